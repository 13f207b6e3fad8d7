/**
 * True for a JSON-style object: not null, not an array. The one test every reader of an untrusted
 * document (a file, a link, a stored workspace) uses before reading fields off a value.
 */
export const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
