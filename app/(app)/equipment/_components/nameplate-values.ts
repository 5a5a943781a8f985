import { nameplateFields, type Nameplate, type NameplateField } from '@/lib/equipment/nameplate';
import type { EquipmentType } from '@/lib/equipment/types';
import { conversionFor, formatQuantity, fromDisplayValue, toDisplayValue, type UnitPrefs } from '@/lib/units/quantities';
import { formatPlain } from '@/lib/format/numbers';

// The nameplate form holds text exactly as typed, in the user's units; these convert it to the
// SI values the schema and API take, and back, so a reopened form shows what was typed.

export type NameplateFormValues = Record<string, string>;

export function fieldLabel(field: NameplateField, prefs: UnitPrefs): string {
  if (field.kind !== 'number') return field.label;
  const unit = field.quantity ? conversionFor(field.quantity, prefs).label : field.unit;
  return unit ? `${field.label} (${unit})` : field.label;
}

export function nameplateToForm(type: EquipmentType, nameplate: Nameplate, prefs: UnitPrefs): NameplateFormValues {
  const out: NameplateFormValues = {};
  for (const field of nameplateFields[type]) {
    const v = nameplate[field.key];
    if (v === null || v === undefined) out[field.key] = '';
    else if (field.kind === 'number' && field.quantity && typeof v === 'number') out[field.key] = toDisplayValue(v, field.quantity, prefs);
    else if (field.kind === 'bool') out[field.key] = v === true ? 'true' : v === false ? 'false' : '';
    else out[field.key] = String(v);
  }
  return out;
}

/** Only the chosen type's keys are sent, so values typed under another type are kept but ignored. */
export function nameplateFromForm(type: EquipmentType, values: NameplateFormValues, prefs: UnitPrefs): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const field of nameplateFields[type]) {
    const text = (values[field.key] ?? '').trim();
    if (text === '') {
      out[field.key] = null;
      continue;
    }
    switch (field.kind) {
      case 'number': {
        if (field.quantity) {
          out[field.key] = fromDisplayValue(text, field.quantity, prefs);
        } else {
          const n = Number(text.replace(',', '.'));
          out[field.key] = Number.isFinite(n) ? n : Number.NaN;
        }
        break;
      }
      case 'bool':
        out[field.key] = text === 'true';
        break;
      default:
        out[field.key] = text;
    }
  }
  return out;
}

export function formatNameplateValue(field: NameplateField, value: Nameplate[string], prefs: UnitPrefs): string | null {
  if (value === null || value === undefined || value === '') return null;
  switch (field.kind) {
    case 'number': {
      if (typeof value !== 'number') return String(value);
      if (field.quantity) return formatQuantity(value, field.quantity, prefs);
      const n = formatPlain(value);
      return field.unit ? `${n} ${field.unit}` : n;
    }
    case 'enum':
      return field.options.find(([v]) => v === String(value))?.[1] ?? String(value);
    case 'bool':
      return value === true ? 'Yes' : value === false ? 'No' : String(value);
    default:
      return String(value);
  }
}

/** "between −14.6 psig and 2,030.5 psig", in the user's units, for range errors. */
export function rangeText(field: NameplateField, prefs: UnitPrefs): string | null {
  if (field.kind !== 'number') return null;
  if (field.quantity) return `between ${formatQuantity(field.min, field.quantity, prefs)} and ${formatQuantity(field.max, field.quantity, prefs)}`;
  const unit = field.unit ? ` ${field.unit}` : '';
  return `between ${formatPlain(field.min)}${unit} and ${formatPlain(field.max)}${unit}`;
}
