// Harness page: a workspace with the scenario panel and the copy-link button; opens #ws1... links.
import { useEffect, useState } from 'react';
import { createRoot } from 'react-dom/client';
import type { Scenario } from '../../../src/core/index.ts';
import { validateDocument } from '../../../src/core/index.ts';
import { ScenarioPanel } from '../../../src/features/scenarios/ScenarioPanel.tsx';
import { CopyLinkButton, LinkNotice } from '../../../src/share/CopyLinkButton.tsx';
import { openLink } from '../../../src/share/linkCodec.ts';
import { baseCurve, FIXTURE } from './harnessData.ts';
import '../../../src/styles/base.css';

const SAVED_KEY = 'harness.saved';
const conventions = { zeroCompounding: 'continuous', zeroDayCount: 'ACT/365F', forwardTenor: '3M', forwardCompounding: 'simple', forwardDayCount: 'ACT/360' } as const;
const start = { ...FIXTURE, scenarios: [] };
if (localStorage.getItem(SAVED_KEY) === null) localStorage.setItem(SAVED_KEY, JSON.stringify(start));

function Page() {
  const [doc, setDoc] = useState<Record<string, unknown> | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => {
    const saved = JSON.parse(localStorage.getItem(SAVED_KEY)!) as Record<string, unknown>;
    void openLink(window.location.hash, saved).then((opened) => {
      setDoc(opened.current as Record<string, unknown>);
      setMessage(opened.message);
      document.body.dataset.ready = 'true';
    });
  }, []);
  if (!doc) return <p>Opening…</p>;
  const checked = validateDocument(doc);
  const ws = checked.ok ? checked.value.workspace : null;
  const curve = ws ? baseCurve(doc) : null;
  return (
    <main>
      <LinkNotice message={message} />
      <CopyLinkButton document={doc} />
      <ScenarioPanel value={doc.scenarios} onChange={(next: Scenario[]) => setDoc({ ...doc, scenarios: next })} workspace={ws} base={curve} conventions={conventions} />
    </main>
  );
}

createRoot(document.getElementById('root')!).render(<Page />);
