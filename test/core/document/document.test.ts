// Validation of the workspace document read from a link or a file: caps, reserved keys, migration.
import { readFileSync } from 'node:fs';
import { LIMITS, linkDocument, migrateDocument, MIGRATE_1_TO_2, parseDocumentText, serialiseDocument, validateDocument } from '../../../src/core/index.ts';

const fixture = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const paths = (doc: unknown): string[] => {
  const r = validateDocument(doc);
  return r.ok ? [] : r.errors.map((e) => e.path);
};

describe('validateDocument(doc)', () => {
  it('accepts the 40-quote fixture with its scenarios, note and view', () => {
    const r = validateDocument(fixture);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.scenarios.map((s) => s.shape.kind)).toEqual(['parallel', 'twist', 'butterfly']);
    expect(r.value.note).toHaveLength(200);
    // A version 1 document is read as version 2: settlement renamed valuationDate, nothing else changed.
    expect(r.value.document).toEqual(MIGRATE_1_TO_2.migrate(fixture as Record<string, unknown>));
    expect(r.value.document).toMatchObject({ version: 2, valuationDate: fixture.settlement });
    expect(r.value.document).not.toHaveProperty('settlement');
  });

  it('refuses documents over the caps, naming the cap', () => {
    const many = { ...fixture, quotes: Array.from({ length: LIMITS.quotes + 1 }, () => ({ kind: 'swap', tenor: '5Y', rate: 0.03 })) };
    const r = validateDocument(many);
    expect(!r.ok && r.errors[0]!.message).toContain('500 a workspace may hold');
    expect(paths({ ...fixture, note: 'x'.repeat(LIMITS.note + 1) })).toEqual(['note']);
    expect(paths({ ...fixture, note: 'x'.repeat(LIMITS.note) })).toEqual([]);
    const scen = (fixture.scenarios as unknown[])[0] as Record<string, unknown>;
    expect(paths({ ...fixture, scenarios: Array.from({ length: 51 }, (_, i) => ({ ...scen, id: `s${i}` })) })).toEqual(['scenarios']);
  });

  it('checks each scenario field and says what would be valid', () => {
    const r = validateDocument({
      ...fixture,
      scenarios: [
        { id: 'a', name: 'A', space: 'curve', shape: { kind: 'parallel', bp: 10 } },
        { id: 'a', name: 'B', space: 'zero', shape: { kind: 'twist', short: '2Y', pivot: '5Y', long: 'later', bp: 10 } },
        { id: 'c', name: 'C', space: 'zero', shape: { kind: 'parallel', bp: '10' } },
        { id: 'd', name: 'D', space: 'zero', shape: { kind: 'wave', bp: 1 } },
        { id: 'e', name: 'E', space: 'zero', shape: { kind: 'parallel', bp: 1, extra: true } },
      ],
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toEqual([
      'scenarios[0].space',
      'scenarios[1].shape.long',
      'scenarios[2].shape.bp',
      'scenarios[3].shape.kind',
      'scenarios[4].shape.extra',
    ]);
    expect(r.errors[0]!.message).toContain('zero, quotes');
  });

  it('checks view values and snapshots', () => {
    expect(paths({ ...fixture, view: { panel: { nested: true } } })).toEqual(['view.panel']);
    expect(paths({ ...fixture, view: { __proto__x: 1 } })).toEqual(['view.__proto__x']);
    expect(paths({ ...fixture, snapshots: [{ name: 'x', takenAt: 'now', settlement: '2026-02-30', quotes: [], curveHash: null }] })).toEqual(['snapshots[0].settlement']);
  });

  it('keeps a document whose single quotes have errors, listing them', () => {
    const quotes = [...(fixture.quotes as unknown[]), { kind: 'swap', tenor: '7Y', rate: 3.5 }];
    const r = validateDocument({ ...fixture, quotes });
    expect(r.ok && r.value.quoteErrors.map((e) => e.path)).toEqual(['quotes[40].rate']);
  });

  it('refuses what is not a workspace', () => {
    expect(paths(null)).toEqual(['']);
    expect(paths({ format: 'other' })).toEqual(['format']);
    expect(paths({ ...fixture, version: 2 })).toEqual(['version']);
  });
});

describe('validateDocument(workbench document)', () => {
  const workbench = JSON.parse(readFileSync(new URL('../../fixtures/share/workbench40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
  const rows = workbench.quotes as Record<string, unknown>[];
  it('accepts the cells as typed and gives the engine workspace they convert to', () => {
    const r = validateDocument(workbench);
    expect(r.ok && r.value.workspace?.quotes.length).toBe(40);
  });
  it('keeps a document whose typed settlement is not a date yet (the sheet shows it)', () => {
    const r = validateDocument({ ...workbench, settlement: '2026-11-3' });
    expect(r.ok && r.value.workspace).toBeNull();
  });
  it('refuses long cells, unknown cells and unknown keys', () => {
    expect(paths({ ...workbench, quotes: [{ ...rows[0], rate: '1'.repeat(65) }] })).toEqual(['quotes[0].rate']);
    expect(paths({ ...workbench, quotes: [{ ...rows[0], formula: '=1' }] })).toEqual(['quotes[0].formula']);
    expect(paths({ ...workbench, extra: 1 })).toEqual(['extra']);
    expect(paths({ ...workbench, version: 3 })).toEqual(['version']);
  });
});

describe('files', () => {
  it('parseDocumentText(serialiseDocument(doc)) gives the same document', () => {
    const r = parseDocumentText(serialiseDocument(fixture));
    expect(r.ok && r.value.document).toEqual(MIGRATE_1_TO_2.migrate(fixture as Record<string, unknown>));
    // And the version 2 file it then saves reads back unchanged.
    const again = r.ok ? parseDocumentText(serialiseDocument(r.value.document)) : null;
    expect(again?.ok && again.value.document).toEqual(r.ok && r.value.document);
  });
  it('reports a file that is not JSON as an error value', () => {
    const r = parseDocumentText('{"format": ');
    expect(!r.ok && r.errors[0]!.code).toBe('invalid-json');
  });
  it('linkDocument leaves snapshots out and nothing else', () => {
    const withSnap = { ...fixture, snapshots: [] };
    expect(linkDocument(withSnap)).toEqual(fixture);
  });
  it('migrateDocument applies the steps from the document version upward', () => {
    const migrations = [{ from: 0, migrate: ({ memo, ...d }: Record<string, unknown>) => ({ ...d, version: 1, note: `migrated: ${String(memo)}` }) }];
    const out = migrateDocument({ ...fixture, version: 0, memo: 'old' }, migrations);
    expect(out.version).toBe(1);
    expect(out.note).toBe('migrated: old');
    const r = validateDocument(JSON.parse(JSON.stringify({ ...fixture, version: 0, memo: 'old' })), migrations);
    expect(r.ok).toBe(true);
  });
});
