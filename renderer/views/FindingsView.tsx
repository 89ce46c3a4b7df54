import { useState } from 'react';
import { thresholdCatalogue } from '../../core/safety';
import { todayIso, useOpenReview } from '../hooks/useReview';
import { useWorkspace, workspaceStore } from '../state/store';
import { findingGroups, withThresholdOverride } from '../viewModels/findings';
import { setBaseField } from '../viewModels/recordEdits';
import { ReviewProblem } from './ReviewProblem';

/** Findings by severity, each with its values, thresholds, rule and sources; a local-protocol threshold with its reason. */
export function FindingsView() {
  const { outcome } = useOpenReview();
  const draft = useWorkspace((state) => state.draft);
  const otherIssues = useWorkspace((state) => state.check?.otherIssues ?? []);
  const [editing, setEditing] = useState<{ id: string; value: string; reason: string; by: string } | null>(null);
  if (!outcome || !draft) return <p>Open a case first.</p>;
  if (!outcome.ok) return <ReviewProblem issues={outcome.issues} />;
  const groups = findingGroups(outcome.review.findings);
  const overrides = (draft.base.thresholdOverrides ?? {}) as Record<string, unknown>;
  const { edit } = workspaceStore.getState();
  const save = () => {
    if (!editing) return;
    edit((current) => setBaseField(current, 'thresholdOverrides', withThresholdOverride(overrides, editing, todayIso())));
    setEditing(null);
  };
  const thresholdIssues = otherIssues.filter((issue) => issue.path[0] === 'thresholdOverrides');
  return (
    <>
      {groups.length === 0 ? <p>No findings on this review date.</p> : null}
      {groups.map((group) => (
        <section key={group.severity} aria-labelledby={`sev-${group.severity}`} className={`findings severity-${group.severity}`}>
          <h2 id={`sev-${group.severity}`}>{group.severity === 'urgent' ? 'Urgent' : group.severity === 'review' ? 'For review' : 'Information'} ({group.cards.length})</h2>
          {group.cards.map((card) => (
            <article key={card.key} className="finding" aria-labelledby={`f-${card.key}`}>
              <h3 id={`f-${card.key}`}><span className="severity-tag">{card.severity}</span> {card.title}</h3>
              <p>{card.text}</p>
              {card.values.length > 0 ? <><h4>Values</h4><ul>{card.values.map((text) => <li key={text}>{text}</li>)}</ul></> : null}
              {card.thresholds.length > 0 ? (
                <>
                  <h4>Thresholds</h4>
                  <ul>
                    {card.thresholds.map((threshold) => (
                      <li key={threshold.id}>
                        {threshold.text}{' '}
                        {thresholdCatalogue.some((it) => it.id === threshold.id) ? (
                          <button type="button" onClick={() => setEditing({ id: threshold.id, value: '', reason: '', by: '' })}>Record a local-protocol value</button>
                        ) : null}
                      </li>
                    ))}
                  </ul>
                </>
              ) : null}
              <p className="rule">Rule: <code>{card.ruleId}</code>{card.sourceUncertain ? ' — a source it rests on is from memory or secondary: check it.' : ''}</p>
              <ul className="sources">{card.sources.map((source) => <li key={source.id}>{source.text} [{source.status}]</li>)}</ul>
            </article>
          ))}
        </section>
      ))}
      {thresholdIssues.length > 0 ? <ul className="field-errors" role="alert">{thresholdIssues.map((issue) => <li key={issue.message}>{issue.message}</li>)}</ul> : null}
      {editing ? (
        <form className="override-form" onSubmit={(event) => { event.preventDefault(); save(); }} aria-labelledby="override-title">
          <h2 id="override-title">Local-protocol value for {editing.id}</h2>
          <label>Value <input value={editing.value} onChange={(event) => setEditing({ ...editing, value: event.target.value })} /></label>
          <label>Reason (the protocol) <input value={editing.reason} onChange={(event) => setEditing({ ...editing, reason: event.target.value })} /></label>
          <label>Recorded by <input value={editing.by} onChange={(event) => setEditing({ ...editing, by: event.target.value })} /></label>
          <button type="submit">Record it</button> <button type="button" onClick={() => setEditing(null)}>Cancel</button>
        </form>
      ) : null}
    </>
  );
}
