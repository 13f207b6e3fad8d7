/** The app's build id, defined by vite.config.ts (`define`), replaced at build time. */
declare global {
  const __BUILD_ID__: string;
}
export {};
