import { download } from '../../components/download.ts';
import { useRef, useState, type ChangeEvent } from 'react';
import { checkListEntry, LIST_FORMAT, LIST_VERSION, splitListFile, type CheckedListFile, type SplitListFile, type WorkbenchDocument, formatRateShort, rateTag } from '../../core/index.ts';
import { addWorkspaces, allRecords, deleteWorkspace, readEntry, renameWorkspace, switchWorkspace, undoDelete } from '../../state/persistence.ts';
import { useAppStore } from '../../state/store.ts';
import { useWorkspaceList, type WorkspaceListItem } from '../../state/workspaceList.ts';
import { SPARK_HEIGHT, SPARK_WIDTH, zeroSparkline } from './sparkline.ts';
import { readCheckedList } from './listFile.ts';
import { readOffThread } from '../../share/offThread.ts';
import { startReader, type ReaderReply, type ReaderRequest } from '../../share/readerRequests.ts';
import './workspaces.css';

export { readListFile } from './listFile.ts';
export { LIST_FORMAT } from '../../core/index.ts';

/** Checks a split list's entries one per task (each at most about 20 ms: one workspace), so a long list never freezes the page. */
async function checkEntriesInSteps(split: SplitListFile): Promise<CheckedListFile> {
  const entries: CheckedListFile['entries'][number][] = [];
  const problems = [...split.problems];
  for (const e of split.entries) {
    const r = checkListEntry(e);
    if (typeof r === 'string') problems.push(r);
    else entries.push(r);
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
  }
  return { entries, problems };
}

const savedText = (ms: number | null): string =>
  ms === null ? 'not saved yet' : `saved ${new Date(ms).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' })}`;

/** Every saved workspace as one file: readable ones as documents, unreadable ones as the text that was kept. */
export async function exportAll(): Promise<string> {
  const records = await allRecords();
  const workspaces = records.map(([key, value]) => {
    if (key.startsWith('kept:')) {
      // A record kept aside as it was saved, when it was restored with changes (over a cap, unknown settings...).
      const name = typeof (value as { name?: unknown })?.name === 'string' ? (value as { name: string }).name : 'workspace';
      return { name: `${name}, as saved before it was restored with changes`, savedAt: null, problem: 'kept aside as it was saved', unreadable: JSON.stringify(value) };
    }
    const r = readEntry(key.slice('entry:'.length), value);
    const raw = value as { unreadable?: unknown };
    if (r.item.workspace) return { name: r.item.name, savedAt: r.item.savedAt, workspace: r.item.workspace };
    return { name: r.item.name, savedAt: r.item.savedAt, problem: r.item.problem, unreadable: typeof raw?.unreadable === 'string' ? raw.unreadable : JSON.stringify(value) };
  });
  return `${JSON.stringify({ format: LIST_FORMAT, version: LIST_VERSION, workspaces }, null, 1)}\n`;
}


function Spark({ doc }: { doc: WorkbenchDocument }) {
  const spark = zeroSparkline(doc);
  if (!spark) return <span className="ws-spark ws-spark-none">no curve</span>;
  const range = `${formatRateShort(spark.low)} to ${formatRateShort(spark.high)}`;
  return (
    <span className="ws-spark-wrap">
      <svg className="ws-spark" width={SPARK_WIDTH} height={SPARK_HEIGHT} viewBox={`0 0 ${SPARK_WIDTH} ${SPARK_HEIGHT}`} role="img" aria-label={`Zero curve from ${range} (${rateTag(spark.compounding, spark.dayCount)})`}>
        <path d={spark.path} fill="none" />
      </svg>
      <span className="ws-spark-range">
        zero {range} <span className="ws-tag">({rateTag(spark.compounding, spark.dayCount)})</span>
      </span>
    </span>
  );
}

function Row({ item, current, liveDoc }: { item: WorkspaceListItem; current: boolean; liveDoc: WorkbenchDocument | null }) {
  const [renaming, setRenaming] = useState(false);
  const [draft, setDraft] = useState(item.name);
  const doc = current ? liveDoc : item.workspace;
  const commit = (): void => {
    setRenaming(false);
    if (draft.trim() !== '' && draft !== item.name) void renameWorkspace(item.id, draft);
  };
  return (
    <li className={`ws-item${current ? ' current' : ''}${item.problem ? ' unreadable' : ''}`} aria-current={current ? 'true' : undefined}>
      <div className="ws-main">
        {renaming ? (
          <input
            className="ws-rename"
            aria-label={`New name for ${item.name}`}
            value={draft}
            autoFocus
            maxLength={120}
            onChange={(e) => setDraft(e.target.value)}
            onBlur={commit}
            onKeyDown={(e) => {
              if (e.key === 'Enter') commit();
              if (e.key === 'Escape') {
                setDraft(item.name);
                setRenaming(false);
              }
            }}
          />
        ) : (
          <span className="ws-name">{item.name}</span>
        )}
        {current && <span className="ws-open-tag">open here</span>}
        <span className="ws-meta">
          {savedText(item.savedAt)}
          {doc ? <> · settles {doc.settlement || '(none)'} · {doc.quotes.length} quotes</> : null}
        </span>
        {item.problem && <span className="ws-problem">Could not be read: {item.problem}.</span>}
      </div>
      {doc ? <Spark doc={doc} /> : <span className="ws-spark ws-spark-none">—</span>}
      <div className="ws-actions">
        <button type="button" disabled={current || !item.workspace} onClick={() => void switchWorkspace(item.id)} aria-label={`Open ${item.name}`}>
          Open
        </button>
        <button
          type="button"
          onClick={() => {
            setDraft(item.name);
            setRenaming(true);
          }}
          aria-label={`Rename ${item.name}`}
        >
          Rename
        </button>
        <button type="button" disabled={current} title={current ? 'Open another workspace first' : undefined} onClick={() => void deleteWorkspace(item.id)} aria-label={`Delete ${item.name}`}>
          Delete
        </button>
      </div>
    </li>
  );
}

/**
 * The saved workspaces of this browser: open one, rename, delete (with Undo), export them all as
 * one file or import such a file. Each entry shows when it was saved, its settlement and a tiny
 * zero curve computed from its inputs.
 */
export function WorkspacesPanel({ onClose }: { onClose?: () => void }) {
  const items = useWorkspaceList((s) => s.items);
  const currentId = useWorkspaceList((s) => s.currentId);
  const deleted = useWorkspaceList((s) => s.deleted);
  const notice = useWorkspaceList((s) => s.notice);
  const liveDoc = useAppStore((s) => s.workspace);
  const backend = useAppStore((s) => s.storage.backend);
  const input = useRef<HTMLInputElement>(null);
  const [message, setMessage] = useState<string | null>(null);
  const sorted = [...items].sort((a, b) => (a.id === currentId ? -1 : b.id === currentId ? 1 : (b.savedAt ?? Infinity) - (a.savedAt ?? Infinity)));
  const importFile = async (e: ChangeEvent<HTMLInputElement>): Promise<void> => {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    let text: string;
    try {
      text = await file.text();
    } catch {
      setMessage(`${file.name} could not be read. Nothing was added.`);
      return;
    }
    const split = await readOffThread<ReaderRequest, SplitListFile, ReaderReply>(text.length, { type: 'list', text, fileName: file.name }, (r) => (r.type === 'list' ? splitListFile(r.text, r.fileName) : { entries: [], problems: [] }), startReader, (reply: ReaderReply) => (reply.type === 'list' ? reply.list : null));
    const { items: found, problems } = readCheckedList(await checkEntriesInSteps(split));
    const added = found.length > 0 ? await addWorkspaces(found) : 0;
    const left = problems.length > 0 ? ` Left out: ${problems.slice(0, 3).join('; ')}${problems.length > 3 ? ` (and ${problems.length - 3} more)` : ''}.` : '';
    setMessage(`Added ${added} workspace${added === 1 ? '' : 's'} from ${file.name}.${left}`);
  };
  return (
    <section className="panel workspaces" aria-label="Workspaces">
      <div className="ws-head">
        <h2>Workspaces in this browser</h2>
        <span className="muted small">{backend === 'indexeddb' ? "kept in the browser's database" : backend === 'localStorage' ? 'kept in localStorage (the database is unavailable)' : 'not kept: this browser gives the page no storage'}</span>
        {onClose && (
          <button type="button" className="ws-close" onClick={onClose}>
            Close
          </button>
        )}
      </div>
      <ul className="ws-list">
        {sorted.map((item) => (
          <Row key={item.id} item={item} current={item.id === currentId} liveDoc={liveDoc} />
        ))}
      </ul>
      {deleted && (
        <p className="notice" role="status">
          Deleted &ldquo;{deleted.name}&rdquo;.{' '}
          <button type="button" onClick={() => void undoDelete()}>
            Undo delete
          </button>
        </p>
      )}
      {(notice ?? message) && (
        <p className="notice" role="status">
          {notice ?? message}
        </p>
      )}
      <div className="ws-foot">
        <button type="button" onClick={() => void exportAll().then((text) => download('tenorscope-workspaces.json', 'application/json', text))}>
          Export all (one file)
        </button>
        <button type="button" onClick={() => input.current?.click()}>
          Import workspaces…
        </button>
        <input ref={input} type="file" accept=".json,application/json" hidden onChange={(e) => void importFile(e)} aria-label="Workspace list file to import" />
      </div>
    </section>
  );
}

/** The header button that shows or hides the Workspaces panel. */
