/**
 * What a row's conventions come to (the Conventions cell's note), fetched the first time a row or
 * the workspace names a convention set (its own chunk), so the first load does not carry it.
 */
export { rowConventions } from '../../core/index.ts';
