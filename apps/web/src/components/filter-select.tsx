// One filter of a list screen: a labelled select whose first choice means "no filter".
import { inputClass } from './field.tsx';

export interface FilterOption {
  value: string;
  label: string;
}

export function FilterSelect(p: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  options: FilterOption[];
  anyLabel?: string;
  wide?: boolean;
}) {
  return (
    <label className="flex items-center gap-2">
      <span className="font-semibold">{p.label}</span>
      <select className={`${inputClass} w-auto ${p.wide ? '' : 'max-w-48'}`} value={p.value} onChange={(e) => p.onChange(e.target.value)}>
        <option value="">{p.anyLabel ?? 'Any'}</option>
        {p.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}
