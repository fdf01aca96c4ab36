import type { SelectHTMLAttributes } from "react";

export interface SelectOption {
  value: string;
  label: string;
}

interface Props extends Omit<SelectHTMLAttributes<HTMLSelectElement>, "children"> {
  options: readonly SelectOption[];
  /** A first option with an empty value ("No location", "Choose…"). */
  emptyOption?: string;
}

/**
 * A select for forms; spread a Field's aria props into it. An uncontrolled one (defaultValue) is keyed by
 * its value, so a refused form that comes back with the typed choice shows it (React resets forms after
 * an action, and a select would otherwise keep the old default).
 */
export function Select({ options, emptyOption, defaultValue, ...props }: Props) {
  return (
    <select key={defaultValue === undefined ? undefined : String(defaultValue)} defaultValue={defaultValue} {...props}>
      {emptyOption !== undefined ? <option value="">{emptyOption}</option> : null}
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
}
