/** Parses and checks a workspace list file (or one workspace file) off the page's thread (checkListFile). */
import { checkListFile } from './listFile.ts';

const scope = self as unknown as { onmessage: ((e: MessageEvent<{ text: string; fileName: string }>) => void) | null; postMessage(message: unknown): void };
scope.onmessage = (e) => scope.postMessage(checkListFile(e.data.text, e.data.fileName));
