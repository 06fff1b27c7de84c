/**
 * The fixed part of the demo scenario: an invented country, its provinces, parties, elections and
 * polling firms. Everything here is fiction written for Veracast; any likeness to a real place,
 * party or firm is accidental. The seeded generator (generate.ts) turns these specifications into
 * votes and polls; the names below never depend on the seed.
 *
 * Units: shares and shifts are in points (0–100) unless a field says otherwise.
 */

export type PollMode = 'phone' | 'ivr' | 'online' | 'text' | 'mixed' | 'face' | 'mail';
export type PollPopulation = 'lv' | 'rv' | 'a';
export type SponsorType = 'media' | 'academic' | 'party' | 'campaign' | '';
export type ContestKind = 'national' | 'province' | 'referendum';

export const DEMO_COUNTRY = {
  name: 'Republic of Almerand',
  shortName: 'Almerand',
  slug: 'almerand',
  fictional: true,
} as const;

export interface DemoProvince {
  readonly key: string;
  readonly name: string;
  /** Registered voters in 2014; grows about 0.6% a year. */
  readonly registered2014: number;
  /** Added to the national turnout (fraction). */
  readonly turnoutShift: number;
  /** Points added to a bloc's national-list share in this province before re-balancing. */
  readonly listOffsets: Readonly<Record<string, number>>;
}

export const DEMO_PROVINCES: readonly DemoProvince[] = [
  { key: 'oridane', name: 'Oridane', registered2014: 1_850_000, turnoutShift: 0.02,
    listOffsets: { LAN: 6, VRD: 3, OAK: -5, FARM: -3 } },
  { key: 'vasselmark', name: 'Vasselmark', registered2014: 1_120_000, turnoutShift: -0.03,
    listOffsets: { LAN: 4, FWD: 3, OAK: -3, TDL: -2 } },
  { key: 'quillon-fens', name: 'Quillon Fens', registered2014: 640_000, turnoutShift: 0.01,
    listOffsets: { OAK: 6, FARM: 5, LAN: -6, VRD: -2 } },
  { key: 'saltreach-coast', name: 'Saltreach Coast', registered2014: 910_000, turnoutShift: 0,
    listOffsets: { TDL: 6, OAK: 1, LAN: -2 } },
  { key: 'pellagor', name: 'Pellagor', registered2014: 1_380_000, turnoutShift: 0.01,
    listOffsets: { VRD: 4, LAN: 2, TDL: 1, OAK: -3 } },
  { key: 'irrindale', name: 'Irrindale', registered2014: 520_000, turnoutShift: -0.01,
    listOffsets: { OAK: 8, FWD: 2, FARM: 3, LAN: -7, VRD: -2 } },
  { key: 'sunhollow', name: 'Sunhollow', registered2014: 760_000, turnoutShift: 0.03,
    listOffsets: { OAK: 1 } },
  { key: 'caskeld', name: 'Caskeld', registered2014: 870_000, turnoutShift: -0.02,
    listOffsets: { LAN: 1, FWD: 2, TDL: -1 } },
  { key: 'vennick-isles', name: 'Vennick Isles', registered2014: 260_000, turnoutShift: -0.04,
    listOffsets: { OAK: 3, TDL: 2, LAN: -3 } },
];

export interface DemoParty {
  readonly key: string;
  readonly name: string;
  /** Bloc key; empty for a party that belongs to no bloc. Two parties may share one bloc. */
  readonly bloc: string;
  /** Internal key used by listOffsets for parties without a bloc. */
  readonly offsetKey: string;
  readonly founded: number;
  /** Runs a national list. */
  readonly nationalList: boolean;
  /** Provinces where it runs a governor candidate ('all' or province keys). */
  readonly governor: 'all' | readonly string[];
  /** Provinces where it stands aside for an ally (no governor candidate). */
  readonly standsAsideIn?: readonly string[];
  /** In governor races, the party whose list share it inherits (regional allies). */
  readonly inheritsFrom?: string;
}

/** Ballot order is this order. */
export const DEMO_PARTIES: readonly DemoParty[] = [
  { key: 'oak', name: 'Oakbound Union', bloc: 'OAK', offsetKey: 'OAK', founded: 1958,
    nationalList: true, governor: 'all', standsAsideIn: ['vennick-isles'] },
  { key: 'lantern', name: 'Lantern Party', bloc: 'LAN', offsetKey: 'LAN', founded: 1946,
    nationalList: true, governor: 'all' },
  { key: 'tidewater', name: 'Tidewater Liberals', bloc: 'TDL', offsetKey: 'TDL', founded: 1971,
    nationalList: true, governor: 'all' },
  { key: 'verdant', name: 'Verdant Commons', bloc: 'VRD', offsetKey: 'VRD', founded: 1989,
    nationalList: true, governor: 'all' },
  { key: 'forward', name: 'Forward Almerand', bloc: 'FWD', offsetKey: 'FWD', founded: 2017,
    nationalList: true, governor: 'all' },
  { key: 'farmers', name: "Lowland Farmers' List", bloc: '', offsetKey: 'FARM', founded: 1994,
    nationalList: true, governor: ['quillon-fens', 'irrindale'] },
  { key: 'isles', name: 'Vennick Isles Compact', bloc: 'OAK', offsetKey: 'ISL', founded: 2001,
    nationalList: false, governor: ['vennick-isles'], inheritsFrom: 'oak' },
];

export interface DemoReferendumSpec {
  /** Contest key suffix. */
  readonly slug: string;
  /** Contest name (the question). */
  readonly question: string;
  /** Designed certified YES share of valid votes. */
  readonly yesShare: number;
  readonly turnout: number;
  /** Shared poll error: points added to YES (taken from NO) on the published scale. */
  readonly sharedBiasYes: number;
  /** Points by which YES stood higher early in the campaign than on polling day. */
  readonly movementYes: number;
}

export interface DemoElectionSpec {
  readonly kind: 'general' | 'referendum';
  readonly year: number;
  readonly date: string;
  readonly name: string;
  /** National-list shares by party key (points, decided voters). */
  readonly nationalList?: Readonly<Record<string, number>>;
  readonly turnout: number;
  /**
   * Shared poll error by bloc, points of share on the published scale, the same for every firm
   * (scaled by the firm's susceptibility). A bloc's points are taken pro rata from the options
   * not listed. Margin error of OAK − LAN = sharedBias.OAK − sharedBias.LAN (plus the pro-rata
   * part when a listed bloc is absent).
   */
  readonly sharedBias: Readonly<Record<string, number>>;
  /** Standard deviation of the extra shared error of each province contest (margin points). */
  readonly provinceBiasSd: number;
  /** Points by which each bloc stood higher early in the campaign than on polling day. */
  readonly movement: Readonly<Record<string, number>>;
  readonly referendum?: DemoReferendumSpec;
  /** Total polls published before this election. */
  readonly polls: number;
  /** Province governor contests still provisional (recount or court challenge pending). */
  readonly provisionalProvinces?: readonly string[];
}

export const DEMO_ELECTIONS: readonly DemoElectionSpec[] = [
  {
    kind: 'general', year: 2014, date: '2014-05-18', name: 'Almerand general election 2014',
    nationalList: { oak: 38.5, lantern: 36, tidewater: 12, verdant: 7.5, farmers: 6 },
    turnout: 0.71, sharedBias: { OAK: 0.25, LAN: -0.25 }, provinceBiasSd: 1.2,
    movement: { OAK: 0.75, LAN: -0.75 }, polls: 160,
  },
  {
    kind: 'general', year: 2018, date: '2018-05-13', name: 'Almerand general election 2018',
    nationalList: { oak: 34.5, lantern: 37, tidewater: 10, verdant: 8, forward: 6.5, farmers: 4 },
    turnout: 0.68, sharedBias: { OAK: -0.6, LAN: 0.6 }, provinceBiasSd: 1.2,
    movement: { OAK: 1.5, LAN: -2, FWD: -0.5, TDL: 1 }, polls: 200,
  },
  {
    kind: 'referendum', year: 2020, date: '2020-10-04',
    name: 'Almerand water authority referendum 2020',
    turnout: 0.52, sharedBias: {}, provinceBiasSd: 0, movement: {}, polls: 100,
    referendum: {
      slug: 'water-authority',
      question: 'Should a national water authority replace the provincial water boards?',
      yesShare: 47.5, turnout: 0.52, sharedBiasYes: -0.75, movementYes: 1,
    },
  },
  {
    kind: 'general', year: 2022, date: '2022-05-15', name: 'Almerand general election 2022',
    nationalList: { oak: 37.5, lantern: 31, forward: 13.5, verdant: 8, tidewater: 6.5, farmers: 3.5 },
    // The shared miss: Oakbound understated by 3 points, Lantern overstated by 1.5, so the
    // OAK − LAN margin is understated by 4.5 points in every contest (see DEMO_SHARED_MISS).
    turnout: 0.66, sharedBias: { OAK: -3, LAN: 1.5 }, provinceBiasSd: 1.2,
    // Forward rose late, at the expense of Tidewater and Verdant; the OAK − LAN margin held still.
    movement: { FWD: -3, TDL: 1.5, VRD: 1.5 }, polls: 260,
  },
  {
    kind: 'general', year: 2026, date: '2026-10-18', name: 'Almerand general election 2026',
    nationalList: { oak: 31, lantern: 33, forward: 17, verdant: 8.5, tidewater: 6.5, farmers: 4 },
    turnout: 0.69, sharedBias: { OAK: -0.25, LAN: 0.25 }, provinceBiasSd: 1.2,
    movement: { LAN: -1.5, VRD: 1, FWD: 0.5 }, polls: 280,
    provisionalProvinces: ['sunhollow', 'vennick-isles'],
    referendum: {
      slug: 'fixed-terms',
      question: 'Should parliament sit for fixed four-year terms?',
      yesShare: 58, turnout: 0.69, sharedBiasYes: -0.5, movementYes: 2,
    },
  },
];

/**
 * The election with the large error shared by most firms, as designed: the polls' OAK − LAN
 * margin was understated by `marginPoints` (sharedBias.OAK − sharedBias.LAN of that election),
 * before house effects and sampling noise. Oakbound won; orient A = OAK, B = LAN.
 */
export const DEMO_SHARED_MISS = {
  electionKey: `${DEMO_COUNTRY.slug}-2022-general`,
  blocA: 'OAK',
  blocB: 'LAN',
  marginPoints: -4.5,
  description:
    'Most firms understated Oakbound Union by about 3 points and overstated Lantern by about 1.5, ' +
    'so their OAK − LAN margin was about 4.5 points too low; the face-to-face and IVR firms were hit less.',
} as const;

export interface DemoSponsor {
  readonly name: string;
  readonly type: SponsorType;
  readonly weight: number;
}

export interface DemoPollster {
  readonly name: string;
  readonly slug: string;
  /** Other spellings found in the poll file. */
  readonly aliases: readonly string[];
  readonly mode: PollMode;
  readonly population: PollPopulation;
  /** Switches to likely voters for fieldwork ending this many days out or fewer. */
  readonly lvWithinDays?: number;
  /** House lean: share points added to `bloc` (taken pro rata from the other options). */
  readonly lean: { readonly bloc: string; readonly points: number };
  /** House lean in referendums: points added to YES (negative: to NO). */
  readonly leanYes: number;
  /** Share of the election's shared error this firm carries (1 = typical). */
  readonly susceptibility: number;
  readonly sampleSize: { readonly mean: number; readonly sd: number; readonly roundTo: number };
  /** Design effect of its weighting (variance inflation over simple random sampling). */
  readonly designEffect: number;
  /** Stated margin of error: none, simple random sampling, or inflated by the design effect. */
  readonly moe: 'none' | 'srs' | 'deff';
  /** Fieldwork end between `latest` and `earliest` days out; shape > 1 crowds polls late. */
  readonly timing: { readonly earliest: number; readonly latest: number; readonly shape: number };
  readonly undecided: number;
  /** Published decimals (0 or 1). */
  readonly decimals: 0 | 1;
  /** Rounds so the shares add to exactly 100 (else rounds each share on its own). */
  readonly forceHundred: boolean;
  /** Options polled under this share (points) are folded into `other`; 0 names every option. */
  readonly lumpBelow: number;
  readonly active: { readonly from: number; readonly to: number };
  readonly weights: { readonly national: number; readonly province: number; readonly referendum: number };
  /** Provinces it polls; all when absent. */
  readonly homeProvinces?: readonly string[];
  readonly sponsors: readonly DemoSponsor[];
}

const NONE: DemoSponsor = { name: '', type: '', weight: 1 };

export const DEMO_POLLSTERS: readonly DemoPollster[] = [
  {
    name: 'Corrowick Research', slug: 'corrowick-research', aliases: [], mode: 'phone', population: 'lv',
    lean: { bloc: 'LAN', points: 0.5 }, leanYes: 0, susceptibility: 1,
    sampleSize: { mean: 1000, sd: 120, roundTo: 1 }, designEffect: 1.3, moe: 'srs',
    timing: { earliest: 42, latest: 2, shape: 1.4 }, undecided: 9, decimals: 0, forceHundred: true,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 1.2, province: 0.8, referendum: 1 },
    sponsors: [{ name: 'The Almerand Courier', type: 'media', weight: 4 }, { ...NONE, weight: 1 }],
  },
  {
    name: 'Brightfen Polling Ltd', slug: 'brightfen-polling', aliases: ['Brightfen Polling', 'BRIGHTFEN POLLING LTD'],
    mode: 'online', population: 'rv', lvWithinDays: 21,
    lean: { bloc: 'OAK', points: 1.5 }, leanYes: 1, susceptibility: 1,
    sampleSize: { mean: 2000, sd: 250, roundTo: 100 }, designEffect: 1.8, moe: 'deff',
    timing: { earliest: 45, latest: 2, shape: 1.2 }, undecided: 11, decimals: 1, forceHundred: true,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 1.6, province: 0.5, referendum: 1.2 },
    sponsors: [{ name: 'Vesper Broadcasting', type: 'media', weight: 2 }, { ...NONE, weight: 2 }],
  },
  {
    name: 'Kestrelmoor Insights', slug: 'kestrelmoor-insights', aliases: [], mode: 'ivr', population: 'lv',
    lean: { bloc: 'OAK', points: 2 }, leanYes: -1, susceptibility: 0.7,
    sampleSize: { mean: 650, sd: 120, roundTo: 1 }, designEffect: 1.5, moe: 'none',
    timing: { earliest: 30, latest: 2, shape: 1 }, undecided: 4, decimals: 0, forceHundred: false,
    lumpBelow: 5, active: { from: 2014, to: 2026 }, weights: { national: 1, province: 0.6, referendum: 0.8 },
    sponsors: [
      { name: 'Oakbound Union', type: 'party', weight: 1 },
      { name: 'Saltreach Herald', type: 'media', weight: 1.5 },
      { ...NONE, weight: 1 },
    ],
  },
  {
    name: 'Northvale Survey Institute', slug: 'northvale-survey-institute', aliases: [], mode: 'face', population: 'a',
    lean: { bloc: 'LAN', points: 0 }, leanYes: -0.5, susceptibility: 0.35,
    sampleSize: { mean: 1500, sd: 200, roundTo: 1 }, designEffect: 1.6, moe: 'deff',
    timing: { earliest: 70, latest: 12, shape: 1 }, undecided: 13, decimals: 1, forceHundred: false,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 0.4, province: 0, referendum: 0.6 },
    sponsors: [{ name: 'Institute for Civic Studies, Oridane', type: 'academic', weight: 1 }],
  },
  {
    name: 'Quorrel Analytics', slug: 'quorrel-analytics', aliases: [], mode: 'mixed', population: 'lv',
    lean: { bloc: 'LAN', points: 0.8 }, leanYes: 0, susceptibility: 1,
    sampleSize: { mean: 1200, sd: 200, roundTo: 1 }, designEffect: 1.5, moe: 'srs',
    timing: { earliest: 40, latest: 3, shape: 1.3 }, undecided: 8, decimals: 0, forceHundred: true,
    lumpBelow: 0, active: { from: 2018, to: 2026 }, weights: { national: 1, province: 0.6, referendum: 1 },
    homeProvinces: ['oridane', 'vasselmark', 'pellagor', 'saltreach-coast'],
    sponsors: [{ name: 'Vesper Broadcasting', type: 'media', weight: 3 }, { ...NONE, weight: 1 }],
  },
  {
    name: 'Halloway & Finch', slug: 'halloway-finch', aliases: ['Halloway and Finch', 'Halloway & Finch Ltd'],
    mode: 'phone', population: 'lv',
    lean: { bloc: 'LAN', points: 2.5 }, leanYes: 0.5, susceptibility: 1,
    sampleSize: { mean: 800, sd: 100, roundTo: 1 }, designEffect: 1.3, moe: 'srs',
    timing: { earliest: 42, latest: 4, shape: 1.5 }, undecided: 7, decimals: 0, forceHundred: false,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 0.9, province: 0.6, referendum: 0.6 },
    sponsors: [
      { name: 'Lantern Party', type: 'party', weight: 1 },
      { name: 'Pellagor Evening Post', type: 'media', weight: 1 },
      { ...NONE, weight: 1 },
    ],
  },
  {
    name: 'Pulsewick Text Surveys', slug: 'pulsewick-text-surveys', aliases: [], mode: 'text', population: 'rv',
    lean: { bloc: 'FWD', points: 2 }, leanYes: 0.5, susceptibility: 1,
    sampleSize: { mean: 900, sd: 150, roundTo: 1 }, designEffect: 1.6, moe: 'none',
    timing: { earliest: 21, latest: 2, shape: 1 }, undecided: 10, decimals: 0, forceHundred: false,
    lumpBelow: 4, active: { from: 2018, to: 2026 }, weights: { national: 0.7, province: 0.3, referendum: 0.8 },
    sponsors: [{ ...NONE, weight: 1 }],
  },
  {
    name: 'Torvane Opinion', slug: 'torvane-opinion', aliases: [], mode: 'online', population: 'a',
    lean: { bloc: 'LAN', points: 1 }, leanYes: 0.5, susceptibility: 1,
    sampleSize: { mean: 2500, sd: 400, roundTo: 50 }, designEffect: 1.9, moe: 'none',
    timing: { earliest: 49, latest: 3, shape: 1.3 }, undecided: 12, decimals: 0, forceHundred: true,
    lumpBelow: 0, active: { from: 2014, to: 2022 }, weights: { national: 1.1, province: 0, referendum: 1 },
    sponsors: [{ name: 'The Almerand Courier', type: 'media', weight: 1 }, { ...NONE, weight: 2 }],
  },
  {
    name: 'Ardentine Strategies', slug: 'ardentine-strategies', aliases: [], mode: 'ivr', population: 'lv',
    lean: { bloc: 'FWD', points: 3 }, leanYes: 0, susceptibility: 0.7,
    sampleSize: { mean: 700, sd: 100, roundTo: 1 }, designEffect: 1.5, moe: 'srs',
    timing: { earliest: 35, latest: 5, shape: 1 }, undecided: 5, decimals: 0, forceHundred: false,
    lumpBelow: 0, active: { from: 2018, to: 2026 }, weights: { national: 0.5, province: 0.2, referendum: 0 },
    sponsors: [{ name: 'Forward Almerand Campaign', type: 'campaign', weight: 1 }],
  },
  {
    name: 'Gullmere Polling Co.', slug: 'gullmere-polling', aliases: [], mode: 'mail', population: 'rv',
    lean: { bloc: 'OAK', points: 0.5 }, leanYes: -1, susceptibility: 1,
    sampleSize: { mean: 2200, sd: 300, roundTo: 1 }, designEffect: 1.2, moe: 'srs',
    timing: { earliest: 84, latest: 14, shape: 1 }, undecided: 9, decimals: 0, forceHundred: false,
    lumpBelow: 0, active: { from: 2014, to: 2020 }, weights: { national: 0.4, province: 0, referendum: 0.8 },
    sponsors: [{ name: 'Saltreach Herald', type: 'media', weight: 1 }],
  },
  {
    name: 'Obrey-Dunn Associates', slug: 'obrey-dunn-associates', aliases: [], mode: 'phone', population: 'lv',
    lean: { bloc: 'OAK', points: 1 }, leanYes: 0, susceptibility: 1,
    sampleSize: { mean: 550, sd: 80, roundTo: 1 }, designEffect: 1.3, moe: 'srs',
    timing: { earliest: 35, latest: 3, shape: 1.2 }, undecided: 10, decimals: 0, forceHundred: false,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 0.3, province: 1.5, referendum: 0.3 },
    homeProvinces: ['pellagor', 'caskeld', 'irrindale', 'quillon-fens'],
    sponsors: [{ name: 'Pellagor Evening Post', type: 'media', weight: 3 }, { ...NONE, weight: 1 }],
  },
  {
    name: 'Caskeld University Election Panel', slug: 'caskeld-university-election-panel', aliases: [],
    mode: 'online', population: 'rv',
    lean: { bloc: 'VRD', points: 1 }, leanYes: 0.5, susceptibility: 1,
    sampleSize: { mean: 3000, sd: 400, roundTo: 10 }, designEffect: 1.7, moe: 'deff',
    timing: { earliest: 63, latest: 7, shape: 1 }, undecided: 7, decimals: 1, forceHundred: false,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 0.4, province: 0, referendum: 0.5 },
    sponsors: [{ name: 'Caskeld University', type: 'academic', weight: 1 }],
  },
  {
    name: 'Beaconrow Data', slug: 'beaconrow-data', aliases: ['Beaconrow Data Ltd', 'beaconrow data'],
    mode: 'online', population: 'lv',
    lean: { bloc: 'OAK', points: 3 }, leanYes: -1.5, susceptibility: 1,
    sampleSize: { mean: 1100, sd: 200, roundTo: 1 }, designEffect: 1.8, moe: 'none',
    timing: { earliest: 28, latest: 2, shape: 1 }, undecided: 6, decimals: 0, forceHundred: false,
    lumpBelow: 3, active: { from: 2022, to: 2026 }, weights: { national: 1, province: 0.3, referendum: 0.8 },
    sponsors: [{ ...NONE, weight: 1 }],
  },
  {
    name: 'Fernlark Research Group', slug: 'fernlark-research-group', aliases: [], mode: 'phone', population: 'rv',
    lvWithinDays: 28,
    lean: { bloc: 'LAN', points: 1.2 }, leanYes: 0, susceptibility: 1,
    sampleSize: { mean: 1100, sd: 150, roundTo: 1 }, designEffect: 1.3, moe: 'srs',
    timing: { earliest: 42, latest: 3, shape: 1.5 }, undecided: 9, decimals: 0, forceHundred: true,
    lumpBelow: 0, active: { from: 2014, to: 2026 }, weights: { national: 1, province: 0.8, referendum: 1 },
    sponsors: [{ name: 'Almerand Public Radio', type: 'media', weight: 3 }, { ...NONE, weight: 1 }],
  },
];

/** Syllables for invented candidate names. */
export const GIVEN_NAMES: readonly string[] = [
  'Maren', 'Tobin', 'Ysolde', 'Corvin', 'Elsbet', 'Dariel', 'Anwen', 'Pieter', 'Sabeth', 'Lucan',
  'Odile', 'Rasmus', 'Tamsin', 'Evander', 'Ilka', 'Joris', 'Brielle', 'Hallam', 'Niamara', 'Quill',
];
export const SURNAME_HEADS: readonly string[] = [
  'Ash', 'Brin', 'Cor', 'Dell', 'Fen', 'Gar', 'Hal', 'Ivel', 'Kor', 'Lun', 'Mar', 'Ness', 'Orl',
  'Pell', 'Quen', 'Ros', 'Sav', 'Tarr', 'Ulm', 'Vay', 'Wend',
];
export const SURNAME_TAILS: readonly string[] = [
  'bury', 'combe', 'dane', 'ett', 'forde', 'holm', 'ick', 'mere', 'ow', 'ridge', 'sted', 'wyn',
];
