// The code of turns and meeting steps, in a chunk of its own: loaded only by a workspace that has them.
export { OVERNIGHT_KIT } from '../core/index.ts';
