/** Largest link fragment read or written, characters (the link codec's cap, share/linkCodec.ts). Apart so the page knows it without loading the codec. */
export const MAX_FRAGMENT_CHARS = 64 * 1024;
