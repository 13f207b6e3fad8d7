/** This build's id (from vite.config.ts), written into every link and printed page. */
export const BUILD_ID: string = typeof __BUILD_ID__ === 'string' ? __BUILD_ID__ : 'unknown-build';
