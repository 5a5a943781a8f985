export interface SelectOption {
  value: string;
  label: string;
}

/** Options from plain values (ASHRAE numbers, time zones) or from labelled values. */
export function optionsOf<T extends string>(values: readonly T[], labels?: Record<T, string>): SelectOption[] {
  return values.map((v) => ({ value: v, label: labels ? labels[v] : v }));
}

/** The `<option>`s of a select, with an optional first, empty choice ("All sites", "Choose…"). */
export function SelectOptions({ options, empty }: { options: readonly SelectOption[]; empty?: string }) {
  return (
    <>
      {empty !== undefined ? <option value="">{empty}</option> : null}
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </>
  );
}
