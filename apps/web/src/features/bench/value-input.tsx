// A reading's input for one hand: the phone's number pad (inputmode decimal) plus buttons that put in the
// letters a value needs (k, M for ohms; µ, n, p for farads; OL on the diode test). Letters typed on a keyboard
// work the same. The text is kept exactly as typed: judging never rewrites it.
import { useRef, type InputHTMLAttributes } from 'react';
import { inputClass } from '../../components/field.tsx';

export function ValueInput({
  value,
  onChange,
  letters,
  letterLabel,
  ...rest
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange'> & {
  value: string;
  onChange: (text: string) => void;
  /** Quick letters shown as buttons beside the input. */
  letters: readonly string[];
  /** Names the input for each letter button ("k into R12's reading"). */
  letterLabel: string;
}) {
  const ref = useRef<HTMLInputElement>(null);
  function insert(letter: string) {
    const input = ref.current;
    if (!input) return;
    if (letter === 'OL') {
      onChange('OL');
      return;
    }
    const start = input.selectionStart ?? value.length;
    const end = input.selectionEnd ?? value.length;
    const next = value.slice(0, start) + letter + value.slice(end);
    onChange(next);
    requestAnimationFrame(() => {
      input.focus();
      input.setSelectionRange(start + letter.length, start + letter.length);
    });
  }
  return (
    <div className="flex min-w-0 items-stretch gap-1">
      <input
        ref={ref}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        autoCorrect="off"
        autoCapitalize="off"
        spellCheck={false}
        enterKeyHint="next"
        className={`${inputClass} min-w-0 flex-1 text-lg tabular`}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        {...rest}
      />
      {!rest.disabled &&
        letters.map((letter) => (
          <button
            key={letter}
            type="button"
            // Keep the caret in the input: a tap on the button must not blur it first.
            onMouseDown={(e) => e.preventDefault()}
            onClick={() => insert(letter)}
            className="min-h-11 min-w-11 rounded-md border border-ink bg-paper-dim px-2 text-lg font-bold text-ink hover:bg-paper-line"
            aria-label={`Type ${letter === 'µ' ? 'micro (µ)' : letter} into ${letterLabel}`}
          >
            {letter}
          </button>
        ))}
    </div>
  );
}

/** The letters a reading in `unit` may need. */
export function lettersFor(unit: string | null): readonly string[] {
  if (unit === 'Ω') return ['k', 'M'];
  if (unit === 'F') return ['µ', 'n', 'p'];
  return [];
}
