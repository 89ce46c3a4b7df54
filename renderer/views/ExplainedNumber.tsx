import type { Derivation } from '../../core/formulas/derivation';

/**
 * A number that shows its derivation when focused or hovered: the focus
 * target is a button, so keyboard users reach every explanation with Tab.
 */
export function ExplainedNumber({ text, derivation, onExplain, label }: {
  readonly text: string;
  readonly label: string;
  readonly derivation: Derivation | null;
  readonly onExplain: (explained: { label: string; derivation: Derivation } | null) => void;
}) {
  if (!derivation) return <span>{text}</span>;
  const show = () => onExplain({ label, derivation });
  return (
    <button type="button" className="explained" onFocus={show} onMouseEnter={show} onClick={show} aria-label={`${label}: ${text}; show how it was computed`}>
      {text}
    </button>
  );
}
