import type { ReactNode, SelectHTMLAttributes } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

/** One option: a value shown as itself, or a value with its own label. */
export type Choice = string | number | { value: string | number; label: ReactNode };

/** Records with an id and a name (yards, keepers, lots…) as choices. */
export function namedChoices(rows: readonly { id: number; name: string }[]): Choice[] {
  return rows.map((r) => ({ value: r.id, label: r.name }));
}

type Props = SelectHTMLAttributes<HTMLSelectElement> & {
  label: ReactNode;
  options: readonly Choice[];
  /** A useActionForm field; a GET filter form gives `name` and `defaultValue` instead. */
  registration?: UseFormRegisterReturn;
};

/** A labelled select of `options`; `className` is the select's (`input min-h-11` unless given). */
export function SelectField({ label, options, registration, id, className = 'input min-h-11', ...rest }: Props) {
  return (
    <label className="field" htmlFor={id}>
      <span>{label}</span>
      <select id={id} className={className} {...registration} {...rest}>
        {options.map((o) => {
          const { value, label } = typeof o === 'object' ? o : { value: o, label: o };
          return (
            <option key={value} value={value}>
              {label}
            </option>
          );
        })}
      </select>
    </label>
  );
}
