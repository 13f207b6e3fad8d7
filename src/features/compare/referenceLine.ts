/**
 * The reference curve's reader for the charts' comparison lines, fetched when a reference curve is
 * first drawn (it is imported in the Snapshots section, whose chunk shares it), so the first load
 * does not carry the CSV reader.
 */
export { parseReferenceCsv } from '../../core/index.ts';
