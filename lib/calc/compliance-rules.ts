// Refrigerant leak-repair rules as data, keyed by jurisdiction, each regime dated as the rules stood
// at the time. US-EPA is the default. Sources (public):
// - 40 CFR 82 Subpart F before 2019: leak-repair thresholds 35 % (commercial refrigeration and
//   industrial process refrigeration) and 15 % (comfort cooling and other), former §82.156(i)
//   (58 FR 28660, 1993; values from memory).
// - The 2016 update (81 FR 82272, 18 Nov 2016) moved leak repair to §82.157 with 20/30/10 % from
//   1 Jan 2019 and extended it to appliances with substitute (HFC) refrigerants of 50 lb or more.
// - 85 FR 14150 (11 Mar 2020, effective 10 Apr 2020) removed the substitute-refrigerant appliances
//   again: §82.157(a) now covers class I/II (ozone-depleting) refrigerants only.
// - 40 CFR 84 Subpart C (89 FR 82682, 11 Oct 2024) from 1 Jan 2026 (§84.106 thresholds).
// Amendments to Part 84 were pending in 2025: re-check eCFR before relying on the dates and thresholds.

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
  /** Last ISO date on which it applied (inclusive); absent while in force. */
  readonly appliesUntil?: string;
  /** Why it ended, when it did. */
  readonly endedBy?: string;
  readonly minFullChargeLb: number;
  /**
   * 'ods': class I/II substances; 'substitute_hfc': a non-ozone-depleting substitute containing an
   * HFC; 'hfc_or_gwp': contains an HFC, or a substitute with GWP above gwpAbove.
   */
  readonly covers: 'ods' | 'substitute_hfc' | 'hfc_or_gwp';
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

/** Former §82.156(i) (1993 rule, values from memory): 35 % commercial and IPR, 15 % comfort cooling and other. */
const THRESHOLDS_BEFORE_2019: Readonly<Record<ApplicationCategory, number>> = {
  commercial_refrigeration: 35,
  industrial_process_refrigeration: 35,
  comfort_cooling: 15,
  refrigerated_transport: 15,
  other: 15,
};

/** §82.157(c)(2) from 1 Jan 2019, and §84.106: 20 % commercial, 30 % IPR, 10 % comfort cooling and other. */
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
        id: 'US-40CFR82F-1993',
        name: '40 CFR 82 Subpart F before 2019 (ozone-depleting refrigerants, Clean Air Act §608)',
        citation: '40 CFR 82.156(i) (1993 rule, 58 FR 28660; thresholds from memory)',
        appliesFrom: '1993-06-14',
        appliesUntil: '2018-12-31',
        endedBy: 'replaced by §82.157 from 2019-01-01 (81 FR 82272)',
        minFullChargeLb: 50,
        covers: 'ods',
        thresholdPct: THRESHOLDS_BEFORE_2019,
      },
      {
        id: 'US-40CFR82F',
        name: '40 CFR 82 Subpart F (ozone-depleting refrigerants, Clean Air Act §608)',
        citation: '40 CFR 82.157',
        appliesFrom: '2019-01-01',
        minFullChargeLb: 50,
        covers: 'ods',
        thresholdPct: THRESHOLDS,
      },
      {
        id: 'US-40CFR82F-HFC',
        name: '40 CFR 82 Subpart F for substitute (HFC) refrigerants, 2019 to 2020',
        citation: '40 CFR 82.157 as amended by 81 FR 82272',
        appliesFrom: '2019-01-01',
        appliesUntil: '2020-04-09',
        endedBy: '85 FR 14150 (effective 2020-04-10) removed appliances with only substitute refrigerants',
        minFullChargeLb: 50,
        covers: 'substitute_hfc',
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
    sources: [
      '40 CFR 82.152 (leak rate)',
      '40 CFR 82.157',
      '58 FR 28660 (1993, former §82.156(i))',
      '81 FR 82272 (2016 update, from 2019-01-01)',
      '85 FR 14150 (2020, substitutes removed from 2020-04-10)',
      '40 CFR 84 Subpart C (89 FR 82682)',
    ],
  },
};

export function getComplianceRules(jurisdiction: JurisdictionId = DEFAULT_JURISDICTION): JurisdictionRules {
  return COMPLIANCE_RULES[jurisdiction];
}
