/** The demo scenario's agency: regions, stocks and people (see README, demo section). */
export const DEMO_PASSWORD = 'corran-firth-demo';

export const DEMO_REGIONS = [
  { code: 'inner-firth', name: 'Inner Firth', description: 'Sheltered upper inlet; trap fisheries.' },
  { code: 'outer-shoals', name: 'Outer Shoals', description: 'Open banks at the mouth of the firth; pelagic fisheries.' },
  { code: 'skerry-reach', name: 'Skerry Reach', description: 'Rocky outer islands; mixed sprat and cod fisheries.' },
  { code: 'moorfell', name: 'Moorfell (upland)', description: 'Upland moor above the firth; driven-grouse shooting.' },
];

export const DEMO_STOCKS = [
  { code: 'blue-lip-crab', name: 'Firth blue-lip crab', region: 'inner-firth', kind: 'single', unit: 't', defaultModel: 'schaefer',
    description: 'Trap survey index and landings since 1990.' },
  { code: 'silver-smelt', name: 'Outer Shoals silver smelt', region: 'outer-shoals', kind: 'single', unit: 't', defaultModel: 'pella-tomlinson',
    description: 'Acoustic survey index and landings since 1990.' },
  { code: 'sprat-ridge-cod', name: 'Skerry sprat and ridge cod', region: 'skerry-reach', kind: 'predator-prey', unit: 't', defaultModel: 'rosenzweig-macarthur',
    description: 'Linked prey (sprat) and predator (ridge cod), one survey each.' },
  { code: 'red-grouse', name: 'Moorfell red grouse', region: 'moorfell', kind: 'single', unit: 'birds', defaultModel: 'schaefer',
    description: 'Spring counts and bag records, in birds.' },
] as const;

export const DEMO_PEOPLE = [
  { email: 'ilse.varga@corran-firth.example', name: 'Ilse Varga', role: 'admin', organisation: 'Corran Firth Resource Commission', region: null },
  { email: 'tomas.reyl@corran-firth.example', name: 'Tomas Reyl', role: 'assessor', organisation: 'Corran Firth Resource Commission', region: null },
  { email: 'priya.ansel@corran-firth.example', name: 'Priya Ansel', role: 'assessor', organisation: 'Corran Firth Resource Commission', region: null },
  { email: 'maren.holt@corran-firth.example', name: 'Maren Holt', role: 'board', organisation: 'Quota board (chair)', region: null },
  { email: 'odhran.pike@corran-firth.example', name: 'Odhran Pike', role: 'board', organisation: 'Quota board', region: null },
  { email: 'ana.lusk@corran-firth.example', name: 'Ana Lusk', role: 'board', organisation: 'Quota board', region: null },
  { email: 'office@skerry-boats.example', name: 'Skerry Reach Boat Co-op', role: 'licensee', organisation: 'Skerry Reach Boat Co-op', region: 'skerry-reach' },
  { email: 'office@inner-firth-potters.example', name: 'Inner Firth Potters Ltd', role: 'licensee', organisation: 'Inner Firth Potters Ltd', region: 'inner-firth' },
  { email: 'keeper@moorfell-estate.example', name: 'Moorfell Estate', role: 'licensee', organisation: 'Moorfell Estate', region: 'moorfell' },
] as const;
