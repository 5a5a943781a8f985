import type { z } from 'zod';
import type { EquipmentType } from '@/lib/equipment/types';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { EntryKind, Severity } from '@/lib/visits/terms';

// The shape every entry kind module fills in. A kind module holds its data schema, the values it
// computes, its sentence and what saving it does on the server; it imports nothing server-only, so
// the phone's forms run the very same code. The server's powers reach it as EntryServerTools.

export interface EntryContext {
  /** The system's refrigerant (else the nameplate's); null when none is on record. */
  refrigerant: string | null;
  elevationM: number;
  designBoxTempC: number | null;
  /** Nameplate supply voltage of the equipment (for the C84.1 check). */
  nameplateVoltage: number | null;
  /** Nominal control-circuit voltage; 24 VAC when the nameplate says nothing. */
  controlVoltageNominal: number | null;
  /** Nameplate high-side design pressure of the system's condensing unit, kPa gauge. */
  designPressureHighKpaG: number | null;
}

/** The server-side context of one entry: the calculation context plus the system's record. */
export interface ServerEntryContext extends EntryContext {
  systemId: string | null;
  application: string | null;
  fullChargeKg: number | null;
}

/** What the unit is, for choosing the kinds and choices that fit it. */
export interface UnitShape {
  type: EquipmentType;
  nameplate: Record<string, unknown>;
}

export interface RefrigerantAddition {
  id: string;
  recordedAt: Date;
  computed: Record<string, unknown> | null;
}

/** What saving an entry may read and change, given by the entries service inside its transaction. */
export interface EntryServerTools {
  ctx: ServerEntryContext;
  recordedAt: Date;
  timeZone: string;
  /** 'YYYY-MM-DD' of an instant on the site's calendar. */
  localDate(at: Date): string;
  /** The system's latest refrigerant addition before (or at, when `inclusive`) this entry. */
  lastAddition(opts: { inclusive: boolean }): Promise<RefrigerantAddition | null>;
  photoOnUnit(photoId: string): Promise<boolean>;
  setCondition(rating: number, note: string | null): Promise<void>;
  /** Merges current settings into the unit's record, unless a later setting change already did. */
  applySettings(patch: Record<string, number>): Promise<void>;
  raiseFollowUp(input: { title: string; severity: Severity }): Promise<void>;
  replaceComponent(newSerial: string | null): Promise<void>;
}

/** Refuses a save with a message on one field (thrown as a validation error by the service). */
export class EntryRefusal extends Error {
  constructor(
    message: string,
    readonly path: string,
    readonly fieldMessage: string,
  ) {
    super(message);
  }
}

export interface EntryKindDef<D = Record<string, unknown>, K extends EntryKind = EntryKind> {
  kind: K;
  /** Whether the kind is offered for this unit. */
  fits(unit: UnitShape): boolean;
  data: z.ZodType<D>;
  /** The entry in one sentence, in the reader's units (history, report, e-mail). */
  describe(data: D, computed: Record<string, unknown> | null, prefs: UnitPrefs): string;
  /** What the server stores beside the data; null when nothing is computed. */
  compute?(data: D, tools: EntryServerTools): Promise<Record<string, unknown> | null>;
  /** What saving it changes beyond the entry row, in the same transaction. */
  apply?(data: D, tools: EntryServerTools): Promise<void>;
}

/** Identity helper that keeps each module's kind and data type while checking it against the shape. */
export function defineKind<D, const K extends EntryKind>(def: EntryKindDef<D, K>): EntryKindDef<D, K> {
  return def;
}
