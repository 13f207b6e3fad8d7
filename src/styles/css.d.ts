/** Plain CSS files imported for their side effect by main.tsx (bundled by vite). */
declare module '*.css';
