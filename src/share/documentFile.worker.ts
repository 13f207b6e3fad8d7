/** Reads a workspace file's text off the page's thread: parse, caps and validation (parseDocumentText). */
import { parseDocumentText } from '../core/index.ts';

const scope = self as unknown as { onmessage: ((e: MessageEvent<string>) => void) | null; postMessage(message: unknown): void };
scope.onmessage = (e) => scope.postMessage(parseDocumentText(e.data));
