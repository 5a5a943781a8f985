// Refrigerant leak-repair rules as data, keyed by jurisdiction. US-EPA is the default.
// Sources: 40 CFR 82 Subpart F (§82.152, §82.157) and 40 CFR 84 Subpart C (final rule 89 FR 82682,
// 11 Oct 2024), as summarised in TRADE-REFERENCE §6. Amendments to Part 84 were pending in 2025:
// re-check eCFR before relying on the dates and thresholds.

export const APPLICATION_CATEGORIES = [
  'commercial_refrigeration',
  'industrial_process_refrigeration',
  'comfort_cooling',
  'refrigerated_transport',
  'other',
] as const;
export type ApplicationCategory = (typeof APPLICATION_CATEGORIES)[number];

export const JURISDICTIONS = ['US-EPA'] as const;
export type JurisdictionId = (typeof JURISDICTIONS)[number];
export const DEFAULT_JURISDICTION: JurisdictionId = 'US-EPA';

export interface LeakRegime {
  readonly id: string;
  readonly name: string;
  readonly citation: string;
  /** ISO date from which the regime applies. */
  readonly appliesFrom: string;
  readonly minFullChargeLb: number;
  /** 'ods': class I/II substances; 'hfc_or_gwp': contains an HFC, or a substitute with GWP above gwpAbove. */
  readonly covers: 'ods' | 'hfc_or_gwp';
  readonly gwpAbove?: number;
  readonly thresholdPct: Readonly<Record<ApplicationCategory, number>>;
  readonly exclusions?: string;
}

export interface JurisdictionRules {
  readonly id: JurisdictionId;
  readonly name: string;
  readonly caution: string;
  readonly regimes: readonly LeakRegime[];
  /** Days from the addition that showed the exceedance to complete the repair. */
  readonly repairDays: number;
  /** Industrial process refrigeration when an industrial process shutdown is needed. */
  readonly repairDaysIprShutdown: number;
  readonly verification: {
    readonly initial: string;
    readonly followUp: string;
    /** Days after the repair for the follow-up test (from memory, not confirmed in the primary text). */
    readonly followUpDays: number;
  };
  readonly chronicLeakerPctOfCharge: number;
  readonly chronicLeakerReport: string;
  readonly recordsYears: number;
  readonly sources: readonly string[];
}

const THRESHOLDS: Readonly<Record<ApplicationCategory, number>> = {
  commercial_refrigeration: 20,
  industrial_process_refrigeration: 30,
  comfort_cooling: 10,
  refrigerated_transport: 10,
  other: 10,
};

export const COMPLIANCE_RULES: Readonly<Record<JurisdictionId, JurisdictionRules>> = {
  'US-EPA': {
    id: 'US-EPA',
    name: 'United States, EPA (40 CFR Parts 82 and 84)',
    caution:
      'Federal US rules only, summarised for guidance. State and local rules (and pending EPA amendments) may be stricter; check the current regulation text.',
    regimes: [
      {
        id: 'US-40CFR82F',
        name: '40 CFR 82 Subpart F (ozone-depleting refrigerants, Clean Air Act §608)',
        citation: '40 CFR 82.157',
        appliesFrom: '2020-04-10',
        minFullChargeLb: 50,
        covers: 'ods',
        thresholdPct: THRESHOLDS,
      },
      {
        id: 'US-40CFR84C',
        name: '40 CFR 84 Subpart C (AIM Act emissions reduction)',
        citation: '40 CFR 84.106',
        appliesFrom: '2026-01-01',
        minFullChargeLb: 15,
        covers: 'hfc_or_gwp',
        gwpAbove: 53,
        thresholdPct: THRESHOLDS,
        exclusions: 'Residential and light-commercial air conditioning and heat pumps are excluded; each independent circuit is one appliance.',
      },
    ],
    repairDays: 30,
    repairDaysIprShutdown: 120,
    verification: {
      initial: 'Initial verification test after the repair, before the appliance is fully recharged (or as soon as practicable).',
      followUp: 'Follow-up verification test once the appliance is back at normal operating conditions.',
      followUpDays: 10,
    },
    chronicLeakerPctOfCharge: 125,
    chronicLeakerReport: 'Report to EPA by 1 March of the following year.',
    recordsYears: 3,
    sources: ['40 CFR 82.152 (leak rate)', '40 CFR 82.157', '40 CFR 84 Subpart C (89 FR 82682)'],
  },
};

export function getComplianceRules(jurisdiction: JurisdictionId = DEFAULT_JURISDICTION): JurisdictionRules {
  return COMPLIANCE_RULES[jurisdiction];
}
