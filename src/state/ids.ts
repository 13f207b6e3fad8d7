/** Row identities for the quote sheet: unique within a page session, never part of a quote. */
let counter = 0;
const session = Math.floor(Math.random() * 36 ** 4).toString(36);
export const makeRowId = (): string => `q${session}${(counter++).toString(36)}`;
