import { keptAtText } from '../state/keptDrafts';

/** "Unsaved entry restored": an entry kept across a reload or a failed save is back on screen, to keep or to discard. */
export function KeptEntryNotice({ what, keptAt, extra, onKeep, onDiscard }: {
  readonly what: string;
  readonly keptAt: string;
  readonly extra?: string;
  readonly onKeep: () => void;
  readonly onDiscard: () => void;
}) {
  return (
    <div className="restored-notice" role="status">
      <p>
        <strong>Unsaved entry restored.</strong> The {what} you typed on {keptAtText(keptAt)} was not saved then; it is back as you left it.{extra ? ` ${extra}` : ''}
      </p>
      <button type="button" onClick={onKeep}>Keep it</button>{' '}
      <button type="button" onClick={onDiscard}>Discard it</button>
    </div>
  );
}
