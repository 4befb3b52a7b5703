// The demo scenario: the invented Larchmere Commons Growing Circle, a year of batches and cases.
// Plain data only, so the seeder, tests and docs can all read it without a database.
// Every person, place and address here is invented; addresses live under example.test.
// Resolved cases are written to make the track records meaningful: some remedies hold up
// steadily (adding sugar, protecting from pests), some do not (scooping out spoiled parts,
// waiting out a bubbling jar), and putrid, black, pink or slimy batches are always lost.
import type { CauseId, RemedyId, StageId, SymptomId } from '../../../shared/vocabulary';
import type { CaseStatus } from '../../../shared/case-status';

type WeightUnit = 'g' | 'kg' | 'oz' | 'lb';

export interface DemoUser {
  key: string;
  email: string;
  displayName: string;
  role: 'grower' | 'mentor' | 'steward';
  about?: string;
  mentorSince?: number /* days ago */;
}

export interface DemoBatch {
  key: string;
  ownerKey: string;
  stage: StageId;
  label: string;
  madeDaysAgo: number;
  ingredients: string;
  culture: { value: number; unit: WeightUnit };
  sugar: { value: number; unit: WeightUnit } | null;
  sugarType: 'brown' | 'white' | 'raw' | null;
  moisturePct?: number;
  container: string;
  cover: string;
  location: string;
  notes?: string;
}

export interface DemoMessage {
  authorKey: string;
  kind: 'text' | 'aside';
  body: string;
  minutesAfterOpen: number;
}

export interface DemoCase {
  key: string;
  batchKey?: string;
  growerKey: string;
  mentorKey?: string;
  stage: StageId;
  symptoms: SymptomId[];
  title: string;
  description: string;
  openedDaysAgo: number;
  location?: string;
  status: CaseStatus;
  cause?: CauseId;
  causeNotes?: string;
  remedy?: RemedyId;
  remedyNotes?: string;
  summary?: string;
  outcome?: 'recovered' | 'partly' | 'lost';
  stars?: 1 | 2 | 3 | 4 | 5;
  recoveryComment?: string;
  consentToPublish?: boolean;
  messages: DemoMessage[];
}

export const DEMO_PASSWORD = 'sporewell-demo';

export const DEMO_USERS: DemoUser[] = [
  // The three accounts the README names.
  {
    key: 'rowan',
    email: 'grower@example.test',
    displayName: 'Rowan Tillsworth',
    role: 'grower',
    about: 'Started a kitchen garden on Fernbrook lane this year and is making a first round of inputs.',
  },
  {
    key: 'marta',
    email: 'mentor@example.test',
    displayName: 'Marta Veldhoen',
    role: 'mentor',
    about: 'Keeps a mixed orchard on the upper terraces and has made IMO every spring for many seasons.',
    mentorSince: 340,
  },
  {
    key: 'idris',
    email: 'steward@example.test',
    displayName: 'Idris Wendleby',
    role: 'steward',
    about: 'Looks after the Circle: the seed-library shed, the rota and this site.',
  },

  // Mentors.
  {
    key: 'tobiah',
    email: 'tobiah.mossgrove@example.test',
    displayName: 'Tobiah Mossgrove',
    role: 'mentor',
    about: 'One of the Circle elders. Bran piles, soil and anything that needs turning with a shovel.',
    mentorSince: 365,
  },
  {
    key: 'ama',
    email: 'ama.oakhollow@example.test',
    displayName: 'Ama Oakhollow',
    role: 'mentor',
    about: 'Teaches the Circle’s spring course on plant and fruit juices.',
    mentorSince: 330,
  },
  {
    key: 'keiko',
    email: 'keiko.ferrisby@example.test',
    displayName: 'Keiko Ferrisby',
    role: 'mentor',
    about: 'Makes LAB and the calcium inputs for the south allotments.',
    mentorSince: 300,
  },
  {
    key: 'dunstan',
    email: 'dunstan.elderwick@example.test',
    displayName: 'Dunstan Elderwick',
    role: 'mentor',
    about: 'Runs the polytunnels by the duck pond; the newest of the Circle’s mentors.',
    mentorSince: 235,
  },

  // Growers.
  { key: 'priya', email: 'priya.lanthorn@example.test', displayName: 'Priya Lanthorn', role: 'grower', about: 'Herbs and salad on the south allotments.' },
  { key: 'kofi', email: 'kofi.ashgrove@example.test', displayName: 'Kofi Ashgrove', role: 'grower', about: 'New to IMO; grows squash and beans at Millrace cottages.' },
  { key: 'ilse', email: 'ilse.marrowby@example.test', displayName: 'Ilse Marrowby', role: 'grower' },
  { key: 'benedikt', email: 'benedikt.sorrel@example.test', displayName: 'Benedikt Sorrel', role: 'grower', about: 'Field vegetables on the low meadow; makes IMO by the sack.' },
  { key: 'nia', email: 'nia.calderwood@example.test', displayName: 'Nia Calderwood', role: 'grower' },
  { key: 'tomasz', email: 'tomasz.wrenfield@example.test', displayName: 'Tomasz Wrenfield', role: 'grower', about: 'Volunteers at the seed-library shed.' },
  { key: 'lucia', email: 'lucia.hollowmere@example.test', displayName: 'Lucia Hollowmere', role: 'grower' },
  { key: 'femi', email: 'femi.aldercott@example.test', displayName: 'Femi Aldercott', role: 'grower', about: 'Tomatoes and peppers in a cold frame on Tansy row.' },
  { key: 'greta', email: 'greta.pinfold@example.test', displayName: 'Greta Pinfold', role: 'grower' },
  { key: 'sami', email: 'sami.rushbrook@example.test', displayName: 'Sami Rushbrook', role: 'grower' },
  { key: 'hana', email: 'hana.ostwick@example.test', displayName: 'Hana Ostwick', role: 'grower', about: 'Berry canes and a small nursery at Sallow Bend.' },
  { key: 'ollie', email: 'ollie.thatchley@example.test', displayName: 'Ollie Thatchley', role: 'grower' },
  { key: 'meilin', email: 'meilin.corrow@example.test', displayName: 'Mei-Lin Corrow', role: 'grower' },
  { key: 'aurelio', email: 'aurelio.bentgrass@example.test', displayName: 'Aurelio Bentgrass', role: 'grower', about: 'Market garden on the upper terraces.' },
  { key: 'della', email: 'della.fairweather@example.test', displayName: 'Della Fairweather', role: 'grower' },
  { key: 'yusuf', email: 'yusuf.harlowe@example.test', displayName: 'Yusuf Harlowe', role: 'grower' },
  { key: 'clementine', email: 'clementine.brindle@example.test', displayName: 'Clementine Brindle', role: 'grower' },
  { key: 'orla', email: 'orla.quennell@example.test', displayName: 'Orla Quennell', role: 'grower' },
  { key: 'ravi', email: 'ravi.stonechat@example.test', displayName: 'Ravi Stonechat', role: 'grower' },
  { key: 'bea', email: 'bea.loxley@example.test', displayName: 'Bea Loxley', role: 'grower', about: 'Student on the spring course.' },
  { key: 'emrys', email: 'emrys.vane@example.test', displayName: 'Emrys Vane', role: 'grower' },
  { key: 'juniper', email: 'juniper.odell@example.test', displayName: 'Juniper Odell', role: 'grower' },
  { key: 'mateo', email: 'mateo.swale@example.test', displayName: 'Mateo Swale', role: 'grower' },
  { key: 'signe', email: 'signe.larkspur@example.test', displayName: 'Signe Larkspur', role: 'grower' },
  { key: 'wilf', email: 'wilf.cotterell@example.test', displayName: 'Wilf Cotterell', role: 'grower', about: 'Weighs everything in pounds and ounces.' },
  { key: 'adaeze', email: 'adaeze.moorcroft@example.test', displayName: 'Adaeze Moorcroft', role: 'grower' },
  { key: 'pim', email: 'pim.vanderhoek@example.test', displayName: 'Pim van der Hoek', role: 'grower' },
  { key: 'ffion', email: 'ffion.tarrant@example.test', displayName: 'Ffion Tarrant', role: 'grower' },
  { key: 'lars', email: 'lars.ekholt@example.test', displayName: 'Lars Ekholt', role: 'grower', about: 'Fruit cage and bramble hedge in the cider orchard.' },
];

const PAPER = 'kitchen paper tied on with string';
const CLOTH = 'double layer of cotton cloth tied under the rim';
const STRAW = 'loose straw with a cotton sheet over it';

export const DEMO_BATCHES: DemoBatch[] = [
  // The demo grower's shelf: a first round of inputs, one thing after another.
  {
    key: 'b-rowan-imo1', ownerKey: 'rowan', stage: 'IMO1', label: 'IMO1 — Crookback wood oaks', madeDaysAgo: 16,
    ingredients: 'short-grain rice, cooked firm', culture: { value: 1.3, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'shallow wooden box', cover: `${PAPER}, bark slab above for rain`, location: 'Crookback wood, under old oaks, deep leaf litter',
    notes: 'Collected on day 5: white all over, smelled of mushrooms. 1.2 kg after picking out the edges.',
  },
  {
    key: 'b-rowan-imo2', ownerKey: 'rowan', stage: 'IMO2', label: 'IMO2 — from the oak box', madeDaysAgo: 9,
    ingredients: 'IMO1 culture from the oak box, brown sugar', culture: { value: 1.2, unit: 'kg' }, sugar: { value: 700, unit: 'g' }, sugarType: 'brown',
    container: 'wide glass jar', cover: PAPER, location: 'kitchen shelf by the back door, about 19 °C',
    notes: 'Only had 700 g of sugar in the house.',
  },
  {
    key: 'b-rowan-fpj', ownerKey: 'rowan', stage: 'FPJ', label: 'FPJ — young nettle tips', madeDaysAgo: 4,
    ingredients: 'young nettle tips picked in the morning, unwashed, brown sugar', culture: { value: 800, unit: 'g' }, sugar: { value: 800, unit: 'g' }, sugarType: 'brown',
    container: 'stoneware crock', cover: PAPER, location: 'porch, afternoon sun',
  },
  {
    key: 'b-rowan-lab', ownerKey: 'rowan', stage: 'LAB', label: 'LAB — first try', madeDaysAgo: 48,
    ingredients: '100 ml soured rice-wash water into 1 litre of milk', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'glass jar', cover: PAPER, location: 'kitchen shelf, shaded, about 20 °C',
    notes: 'Harvested about 700 ml of serum on day 5; in the fridge.',
  },
  {
    key: 'b-rowan-wca', ownerKey: 'rowan', stage: 'WCA', label: 'WCA — winter eggshells', madeDaysAgo: 60,
    ingredients: 'eggshells, membranes rubbed off, toasted light brown; brewed rice vinegar (2 kg)', culture: { value: 200, unit: 'g' }, sugar: null, sugarType: null,
    container: 'tall glass jar', cover: 'paper, lid resting on top', location: 'utility room shelf',
    notes: 'Bubbling stopped on day 10. Strained and bottled.',
  },

  // Mentors' own batches.
  {
    key: 'b-marta-imo1', ownerKey: 'marta', stage: 'IMO1', label: 'IMO1 — terrace beeches, spring', madeDaysAgo: 365,
    ingredients: 'medium-grain rice, cooked firm', culture: { value: 2, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'two cedar boxes', cover: `${PAPER}, wire mesh and a rain sheet`, location: 'the upper terraces, beech hanger litter',
  },
  {
    key: 'b-marta-imo2', ownerKey: 'marta', stage: 'IMO2', label: 'IMO2 — terrace beeches, spring', madeDaysAgo: 358,
    ingredients: 'IMO1 from the terrace beeches, brown sugar', culture: { value: 1.9, unit: 'kg' }, sugar: { value: 1.9, unit: 'kg' }, sugarType: 'brown',
    container: 'clay crock', cover: PAPER, location: 'cellar, about 12 °C',
    notes: 'Still quiet and sweet a year on. The Circle’s mother culture for bran piles.',
  },
  {
    key: 'b-tobiah-imo3', ownerKey: 'tobiah', stage: 'IMO3', label: 'IMO3 — commons barn, big pile', madeDaysAgo: 345,
    ingredients: 'wheat bran, IMO2 diluted in rainwater', culture: { value: 40, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 65,
    container: 'heap on the earth floor', cover: STRAW, location: 'the commons barn',
    notes: 'Peaked at 47 °C on day 3, turned daily. White through by day 6.',
  },
  {
    key: 'b-ama-fpj', ownerKey: 'ama', stage: 'FPJ', label: 'FPJ — course demonstration, mugwort tips', madeDaysAgo: 100,
    ingredients: 'young mugwort tips, unwashed, brown sugar', culture: { value: 1, unit: 'kg' }, sugar: { value: 1, unit: 'kg' }, sugarType: 'brown',
    container: 'stoneware crock', cover: PAPER, location: 'the seed-library shed, shaded',
  },
  {
    key: 'b-keiko-lab', ownerKey: 'keiko', stage: 'LAB', label: 'LAB — allotment batch', madeDaysAgo: 20,
    ingredients: 'rice-wash starter 1 part to 10 parts milk; serum kept with equal weight of brown sugar', culture: { value: 500, unit: 'g' }, sugar: { value: 500, unit: 'g' }, sugarType: 'brown',
    container: 'glass bottle, loose cap', cover: 'loose cap', location: 'cellar fridge',
  },

  // Growers' batches, roughly in order of the year.
  {
    key: 'b-kofi-imo1', ownerKey: 'kofi', stage: 'IMO1', label: 'IMO1 — Crookback wood beeches', madeDaysAgo: 340,
    ingredients: 'short-grain rice, cooked firm', culture: { value: 1.5, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'cedar box', cover: PAPER, location: 'Crookback wood, under beeches',
  },
  {
    key: 'b-kofi-imo2', ownerKey: 'kofi', stage: 'IMO2', label: 'IMO2 — from the beech box', madeDaysAgo: 333,
    ingredients: 'IMO1 culture, green corner removed; brown sugar', culture: { value: 1.3, unit: 'kg' }, sugar: { value: 1.3, unit: 'kg' }, sugarType: 'brown',
    container: 'glass jar', cover: PAPER, location: 'pantry floor',
  },
  {
    key: 'b-priya-imo1', ownerKey: 'priya', stage: 'IMO1', label: 'IMO1 — allotment hedge', madeDaysAgo: 330,
    ingredients: 'long-grain white rice, cooked firm', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'wooden fruit tray', cover: PAPER, location: 'under the old hedge by the south allotments',
  },
  {
    key: 'b-priya-imo2', ownerKey: 'priya', stage: 'IMO2', label: 'IMO2 — allotment hedge', madeDaysAgo: 322,
    ingredients: 'IMO1 from the hedge tray, brown sugar', culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' }, sugarType: 'brown',
    container: 'clay crock', cover: PAPER, location: 'pantry, about 18 °C',
    notes: 'Topped up with another 450 g brown sugar on day 6.',
  },
  {
    key: 'b-bea-fpj', ownerKey: 'bea', stage: 'FPJ', label: 'FPJ — comfrey and dock', madeDaysAgo: 320,
    ingredients: 'comfrey and dock leaves, washed, brown sugar', culture: { value: 1, unit: 'kg' }, sugar: { value: 400, unit: 'g' }, sugarType: 'brown',
    container: 'plastic bucket', cover: 'lid pressed on', location: 'garden shed',
  },
  {
    key: 'b-bea-fpj-2', ownerKey: 'bea', stage: 'FPJ', label: 'FPJ — comfrey tips, second go', madeDaysAgo: 312,
    ingredients: 'young comfrey tips, unwashed, picked in the morning; brown sugar', culture: { value: 1, unit: 'kg' }, sugar: { value: 1, unit: 'kg' }, sugarType: 'brown',
    container: 'stoneware crock', cover: PAPER, location: 'garden shed, shaded',
    notes: 'Strained on day 7. Sweet, winey, no trouble.',
  },
  {
    key: 'b-hana-imo1', ownerKey: 'hana', stage: 'IMO1', label: 'IMO1 — Sallow Bend hazels', madeDaysAgo: 300,
    ingredients: 'rice, cooked soft', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'wooden box', cover: `${PAPER}, plastic sheet over`, location: 'Sallow Bend, under hazels',
  },
  {
    key: 'b-ilse-lab', ownerKey: 'ilse', stage: 'LAB', label: 'LAB — shed batch', madeDaysAgo: 300,
    ingredients: '100 ml rice-wash starter into 1 litre of milk', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'glass jar', cover: PAPER, location: 'unheated shed, about 9–10 °C',
  },
  {
    key: 'b-hana-imo1-2', ownerKey: 'hana', stage: 'IMO1', label: 'IMO1 — Sallow Bend hazels, second box', madeDaysAgo: 290,
    ingredients: 'rice, cooked firm', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'wooden box, scrubbed and sun-dried', cover: `${PAPER}, rain sheet weighted with a stone`, location: 'Sallow Bend, under hazels',
    notes: 'White all over on day 4.',
  },
  {
    key: 'b-emrys-fpj', ownerKey: 'emrys', stage: 'FPJ', label: 'FPJ — nettle tops', madeDaysAgo: 290,
    ingredients: 'nettle tops, unwashed, brown sugar', culture: { value: 800, unit: 'g' }, sugar: { value: 800, unit: 'g' }, sugarType: 'brown',
    container: 'wide glass jar', cover: PAPER, location: 'back kitchen, shaded',
  },
  {
    key: 'b-nia-imo2', ownerKey: 'nia', stage: 'IMO2', label: 'IMO2 — rainy week catch', madeDaysAgo: 280,
    ingredients: 'IMO1 culture (rice cooked soft, box got damp), brown sugar', culture: { value: 1.4, unit: 'kg' }, sugar: { value: 1.4, unit: 'kg' }, sugarType: 'brown', moisturePct: 77,
    container: 'glass jar', cover: PAPER, location: 'larder shelf',
  },
  {
    key: 'b-sami-imo3', ownerKey: 'sami', stage: 'IMO3', label: 'IMO3 — barn pile, autumn', madeDaysAgo: 262,
    ingredients: 'wheat bran, diluted IMO2', culture: { value: 12, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 65,
    container: 'heap on the earth floor', cover: STRAW, location: 'the commons barn',
  },
  {
    key: 'b-mateo-imo1', ownerKey: 'mateo', stage: 'IMO1', label: 'IMO1 — quarry copse', madeDaysAgo: 250,
    ingredients: 'rice, cooked firm', culture: { value: 1.2, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'wooden box', cover: PAPER, location: 'the old quarry copse, under birches',
  },
  {
    key: 'b-orla-imo3', ownerKey: 'orla', stage: 'IMO3', label: 'IMO3 — low barn', madeDaysAgo: 252,
    ingredients: 'rice bran, diluted IMO2', culture: { value: 15, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 62,
    container: 'heap on the earth floor', cover: STRAW, location: 'low barn by the meadow gate',
  },
  {
    key: 'b-orla-imo4', ownerKey: 'orla', stage: 'IMO4', label: 'IMO4 — low field', madeDaysAgo: 240,
    ingredients: 'IMO3 and low-field soil, about half and half', culture: { value: 30, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'low heap on bare ground', cover: 'hessian sacks', location: 'low barn by the meadow gate',
  },
  {
    key: 'b-yusuf-imo2', ownerKey: 'yusuf', stage: 'IMO2', label: 'IMO2 — hedge catch', madeDaysAgo: 230,
    ingredients: 'IMO1 culture, brown sugar', culture: { value: 2, unit: 'lb' }, sugar: { value: 1, unit: 'lb' }, sugarType: 'brown',
    container: 'ceramic crock', cover: PAPER, location: 'garden shed, about 16 °C',
  },
  {
    key: 'b-kofi-lab', ownerKey: 'kofi', stage: 'LAB', label: 'LAB — utility room', madeDaysAgo: 222,
    ingredients: 'rice-wash starter into 2 litres of raw milk', culture: { value: 2, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'large glass jar', cover: PAPER, location: 'utility room, about 26 °C',
  },
  {
    key: 'b-benedikt-imo1', ownerKey: 'benedikt', stage: 'IMO1', label: 'IMO1 — meadow oaks', madeDaysAgo: 212,
    ingredients: 'rice, cooked firm', culture: { value: 3, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'three wooden boxes', cover: `${PAPER}, mesh and rain sheet`, location: 'oak stand at the top of the low meadow',
  },
  {
    key: 'b-benedikt-imo2', ownerKey: 'benedikt', stage: 'IMO2', label: 'IMO2 — meadow oaks', madeDaysAgo: 205,
    ingredients: 'IMO1 from the meadow oaks, brown sugar', culture: { value: 2.8, unit: 'kg' }, sugar: { value: 2.8, unit: 'kg' }, sugarType: 'brown',
    container: 'two clay crocks', cover: PAPER, location: 'farmhouse cellar',
  },
  {
    key: 'b-ollie-wcs', ownerKey: 'ollie', stage: 'WCS', label: 'WCS — fire-pit bones', madeDaysAgo: 200,
    ingredients: 'chicken and pork bones, charred on the fire pit (some meat left on); vinegar (5 kg)', culture: { value: 500, unit: 'g' }, sugar: null, sugarType: null,
    container: 'plastic tub', cover: 'cloth', location: 'back yard',
  },
  {
    key: 'b-juniper-fpj', ownerKey: 'juniper', stage: 'FPJ', label: 'FPJ — pumpkin vine tips', madeDaysAgo: 200,
    ingredients: 'pumpkin vine tips, brown sugar', culture: { value: 600, unit: 'g' }, sugar: { value: 600, unit: 'g' }, sugarType: 'brown',
    container: 'glass jar', cover: PAPER, location: 'spare room, shaded',
  },
  {
    key: 'b-lucia-imo1', ownerKey: 'lucia', stage: 'IMO1', label: 'IMO1 — Fernbrook lane hedge', madeDaysAgo: 200,
    ingredients: 'rice, cooked firm', culture: { value: 700, unit: 'g' }, sugar: null, sugarType: null,
    container: 'wooden box', cover: PAPER, location: 'Fernbrook lane, leaf litter under the holly hedge',
  },
  {
    key: 'b-lucia-imo2', ownerKey: 'lucia', stage: 'IMO2', label: 'IMO2 — Fernbrook lane hedge', madeDaysAgo: 193,
    ingredients: 'IMO1 culture, brown sugar', culture: { value: 600, unit: 'g' }, sugar: { value: 600, unit: 'g' }, sugarType: 'brown',
    container: 'glass jar with screw lid', cover: 'screw lid, done up', location: 'kitchen cupboard, about 20 °C',
    notes: 'Lid swapped for paper on day 5.',
  },
  {
    key: 'b-ollie-wcs-2', ownerKey: 'ollie', stage: 'WCS', label: 'WCS — cleaned bones, second go', madeDaysAgo: 185,
    ingredients: 'bones boiled clean, charred until they snap; vinegar (3 kg)', culture: { value: 300, unit: 'g' }, sugar: null, sugarType: null,
    container: 'wide glass jar', cover: PAPER, location: 'shed shelf, door shut',
    notes: 'Clean vinegar smell throughout. Finished bubbling on day 12.',
  },
  {
    key: 'b-hana-ohn', ownerKey: 'hana', stage: 'OHN', label: 'OHN — ginger', madeDaysAgo: 180,
    ingredients: 'sliced ginger moistened with beer, brown sugar, then clear spirit', culture: { value: 500, unit: 'g' }, sugar: { value: 300, unit: 'g' }, sugarType: 'brown',
    container: 'glass jar', cover: 'paper during the sugar stage, loose lid after', location: 'cool larder',
  },
  {
    key: 'b-benedikt-imo3', ownerKey: 'benedikt', stage: 'IMO3', label: 'IMO3 — meadow barn pile', madeDaysAgo: 170,
    ingredients: 'wheat bran, IMO2 (200 g) diluted in water', culture: { value: 20, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 74,
    container: 'heap on the earth floor', cover: STRAW, location: 'meadow barn',
  },
  {
    key: 'b-signe-wca', ownerKey: 'signe', stage: 'WCA', label: 'WCA — raw shells', madeDaysAgo: 170,
    ingredients: 'eggshells, crushed, not toasted, membranes left on; vinegar (2.5 kg)', culture: { value: 250, unit: 'g' }, sugar: null, sugarType: null,
    container: 'glass jar', cover: PAPER, location: 'back porch',
  },
  {
    key: 'b-pim-ffj', ownerKey: 'pim', stage: 'FFJ', label: 'FFJ — windfall apples', madeDaysAgo: 160,
    ingredients: 'windfall apples, some soft and brown; white sugar', culture: { value: 1.5, unit: 'kg' }, sugar: { value: 1, unit: 'kg' }, sugarType: 'white',
    container: 'food-grade bucket', cover: 'cloth', location: 'the cider orchard store',
  },
  {
    key: 'b-benedikt-imo4', ownerKey: 'benedikt', stage: 'IMO4', label: 'IMO4 — upper terrace soil', madeDaysAgo: 158,
    ingredients: 'IMO3 from the meadow barn with equal parts soil from the upper terraces', culture: { value: 40, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'low heap on bare ground', cover: STRAW, location: 'meadow barn',
  },
  {
    key: 'b-signe-wca-2', ownerKey: 'signe', stage: 'WCA', label: 'WCA — toasted shells', madeDaysAgo: 155,
    ingredients: 'eggshells, membranes peeled, toasted light brown; brewed rice vinegar (2 kg)', culture: { value: 200, unit: 'g' }, sugar: null, sugarType: null,
    container: 'tall glass jar', cover: PAPER, location: 'back porch, shaded',
    notes: 'Clean sharp smell. Done on day 9.',
  },
  {
    key: 'b-femi-imo2', ownerKey: 'femi', stage: 'IMO2', label: 'IMO2 — windowsill crock', madeDaysAgo: 150,
    ingredients: 'IMO1 culture, brown sugar', culture: { value: 2, unit: 'kg' }, sugar: { value: 2, unit: 'kg' }, sugarType: 'brown',
    container: 'large crock', cover: PAPER, location: 'south windowsill, 29–30 °C in the afternoon',
    notes: 'Moved to the pantry floor (about 15 °C) on day 6.',
  },
  {
    key: 'b-pim-ffj-2', ownerKey: 'pim', stage: 'FFJ', label: 'FFJ — picked apples', madeDaysAgo: 150,
    ingredients: 'sound picked apples, bruises allowed; brown sugar', culture: { value: 1.5, unit: 'kg' }, sugar: { value: 1.5, unit: 'kg' }, sugarType: 'brown',
    container: 'food-grade bucket, scrubbed', cover: CLOTH, location: 'the cider orchard store',
  },
  {
    key: 'b-tomasz-ohn', ownerKey: 'tomasz', stage: 'OHN', label: 'OHN — garlic', madeDaysAgo: 150,
    ingredients: 'crushed garlic cloves, moistened, brown sugar, then clear spirit', culture: { value: 400, unit: 'g' }, sugar: { value: 250, unit: 'g' }, sugarType: 'brown',
    container: 'glass jar', cover: 'loose lid', location: 'the seed-library shed',
  },
  {
    key: 'b-meilin-fpj', ownerKey: 'meilin', stage: 'FPJ', label: 'FPJ — squash vine tips', madeDaysAgo: 140,
    ingredients: 'squash vine tips, unwashed, brown sugar', culture: { value: 1, unit: 'kg' }, sugar: { value: 1, unit: 'kg' }, sugarType: 'brown',
    container: 'glass jar', cover: 'paper with a rubber band', location: 'front porch',
  },
  {
    key: 'b-greta-imo3', ownerKey: 'greta', stage: 'IMO3', label: 'IMO3 — polytunnel pile', madeDaysAgo: 130,
    ingredients: 'rice bran, diluted IMO2', culture: { value: 15, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 63,
    container: 'heap on bare soil', cover: 'plastic sheet', location: 'south side of the polytunnels by the duck pond, full sun',
  },
  {
    key: 'b-sami-lab', ownerKey: 'sami', stage: 'LAB', label: 'LAB serum — stored', madeDaysAgo: 130,
    ingredients: 'LAB serum harvested from a 1 : 10 milk batch, no sugar', culture: { value: 500, unit: 'g' }, sugar: null, sugarType: null,
    container: 'glass bottle, loose cap', cover: 'loose cap', location: 'pantry shelf, about 20 °C',
  },
  {
    key: 'b-signe-imo1', ownerKey: 'signe', stage: 'IMO1', label: 'IMO1 — terrace pines', madeDaysAgo: 120,
    ingredients: 'rice, cooked firm', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'shallow wooden box', cover: PAPER, location: 'the upper terraces, under pines',
    notes: 'Moved under the oaks further down on day 6.',
  },
  {
    key: 'b-ravi-imo3', ownerKey: 'ravi', stage: 'IMO3', label: 'IMO3 — lower field', madeDaysAgo: 118,
    ingredients: 'wheat bran, diluted IMO2', culture: { value: 10, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 66,
    container: 'heap on the earth floor', cover: STRAW, location: 'the commons barn',
  },
  {
    key: 'b-ravi-imo4', ownerKey: 'ravi', stage: 'IMO4', label: 'IMO4 — lower field', madeDaysAgo: 110,
    ingredients: 'IMO3 and soil from the lower field', culture: { value: 20, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'heap in the open', cover: 'one hessian sack', location: 'edge of the lower field, exposed to wind',
  },
  {
    key: 'b-della-imo2', ownerKey: 'della', stage: 'IMO2', label: 'IMO2 — cellar jar', madeDaysAgo: 100,
    ingredients: 'IMO1 culture, raw sugar', culture: { value: 1, unit: 'kg' }, sugar: { value: 1, unit: 'kg' }, sugarType: 'raw',
    container: 'clay crock', cover: PAPER, location: 'cellar, about 12 °C',
  },
  {
    key: 'b-tomasz-imo3', ownerKey: 'tomasz', stage: 'IMO3', label: 'IMO3 — shed pile', madeDaysAgo: 95,
    ingredients: 'wheat bran, diluted IMO2 (too little)', culture: { value: 10, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 45,
    container: 'heap on concrete', cover: 'old sheet', location: 'the seed-library shed, concrete floor',
  },
  {
    key: 'b-adaeze-ffj', ownerKey: 'adaeze', stage: 'FFJ', label: 'FFJ — ripe plums', madeDaysAgo: 90,
    ingredients: 'ripe plums, halved; brown sugar', culture: { value: 2, unit: 'kg' }, sugar: { value: 2, unit: 'kg' }, sugarType: 'brown',
    container: 'food-grade bucket', cover: 'cloth', location: 'back step',
  },
  {
    key: 'b-greta-wca', ownerKey: 'greta', stage: 'WCA', label: 'WCA — toasted shells', madeDaysAgo: 85,
    ingredients: 'eggshells, toasted and crushed; brewed rice vinegar (2 kg)', culture: { value: 200, unit: 'g' }, sugar: null, sugarType: null,
    container: 'tall glass jar', cover: 'paper, lid resting on top', location: 'polytunnel potting bench',
  },
  {
    key: 'b-ffion-ffj', ownerKey: 'ffion', stage: 'FFJ', label: 'FFJ — ripe pears', madeDaysAgo: 75,
    ingredients: 'ripe pears, chopped; brown sugar', culture: { value: 1.5, unit: 'kg' }, sugar: { value: 1.5, unit: 'kg' }, sugarType: 'brown',
    container: 'glass jar', cover: PAPER, location: 'next to the wood stove, about 28 °C',
  },
  {
    key: 'b-clementine-imo3', ownerKey: 'clementine', stage: 'IMO3', label: 'IMO3 — barn corner', madeDaysAgo: 70,
    ingredients: 'wheat bran, diluted IMO2', culture: { value: 8, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 67,
    container: 'heap on the earth floor', cover: 'plastic sheet laid on the pile', location: 'the commons barn, back corner',
  },
  {
    key: 'b-priya-ohn', ownerKey: 'priya', stage: 'OHN', label: 'OHN — cinnamon bark and liquorice root', madeDaysAgo: 60,
    ingredients: 'cinnamon bark and liquorice root (300 g each), brown sugar, then clear spirit', culture: { value: 600, unit: 'g' }, sugar: { value: 400, unit: 'g' }, sugarType: 'brown',
    container: 'two glass jars', cover: 'paper, then loose lids', location: 'cool cupboard away from the stove',
  },
  {
    key: 'b-aurelio-fpj', ownerKey: 'aurelio', stage: 'FPJ', label: 'FPJ — nettle and chickweed', madeDaysAgo: 55,
    ingredients: 'nettle and chickweed tips, brown sugar', culture: { value: 1.2, unit: 'kg' }, sugar: { value: 700, unit: 'g' }, sugarType: 'brown',
    container: 'stoneware crock', cover: PAPER, location: 'tool shed, about 15 °C',
    notes: 'Made the sugar up to 1.2 kg on day 2.',
  },
  {
    key: 'b-wilf-imo2', ownerKey: 'wilf', stage: 'IMO2', label: 'IMO2 — weighed in pounds', madeDaysAgo: 45,
    ingredients: 'IMO1 culture, brown sugar', culture: { value: 1.5, unit: 'lb' }, sugar: { value: 1, unit: 'lb' }, sugarType: 'brown',
    container: 'wide-mouth glass jar', cover: PAPER, location: 'garage shelf, about 17 °C',
    notes: 'Topped up with 8 oz brown sugar on day 6.',
  },
  {
    key: 'b-lars-ffj', ownerKey: 'lars', stage: 'FFJ', label: 'FFJ — blackberries', madeDaysAgo: 35,
    ingredients: 'blackberries, brown sugar', culture: { value: 3, unit: 'kg' }, sugar: { value: 3, unit: 'kg' }, sugarType: 'brown',
    container: 'food-grade bucket', cover: 'cloth tied with string', location: 'lean-to by the cider orchard',
  },
  {
    key: 'b-mateo-wca', ownerKey: 'mateo', stage: 'WCA', label: 'WCA — kitchen shells', madeDaysAgo: 30,
    ingredients: 'eggshells, toasted and crushed; vinegar (1.5 kg)', culture: { value: 150, unit: 'g' }, sugar: null, sugarType: null,
    container: 'glass jar with screw lid', cover: 'screw lid, done up', location: 'kitchen shelf',
  },
  {
    key: 'b-della-wcs', ownerKey: 'della', stage: 'WCS', label: 'WCS — beef bones', madeDaysAgo: 25,
    ingredients: 'beef bones, boiled clean and charred black; vinegar (3 kg)', culture: { value: 300, unit: 'g' }, sugar: null, sugarType: null,
    container: 'wide glass jar', cover: PAPER, location: 'outhouse shelf',
  },
  {
    key: 'b-adaeze-fpj', ownerKey: 'adaeze', stage: 'FPJ', label: 'FPJ — bean tips', madeDaysAgo: 15,
    ingredients: 'runner bean tips, unwashed, brown sugar', culture: { value: 500, unit: 'g' }, sugar: { value: 500, unit: 'g' }, sugarType: 'brown',
    container: 'glass jar', cover: CLOTH, location: 'back step, jar standing in a water tray',
  },
  {
    key: 'b-ffion-lab', ownerKey: 'ffion', stage: 'LAB', label: 'LAB — back room', madeDaysAgo: 12,
    ingredients: '100 ml rice-wash starter into 1 litre of milk', culture: { value: 1, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'glass jar', cover: PAPER, location: 'unheated back room, about 16 °C',
  },
  {
    key: 'b-clementine-imo4', ownerKey: 'clementine', stage: 'IMO4', label: 'IMO4 — barn corner soil', madeDaysAgo: 9,
    ingredients: 'IMO3 from the barn corner and soil from the beds, half and half', culture: { value: 16, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'low heap on the earth floor', cover: STRAW, location: 'the commons barn, back corner',
  },
  {
    key: 'b-nia-lab', ownerKey: 'nia', stage: 'LAB', label: 'LAB — kitchen batch', madeDaysAgo: 7,
    ingredients: '150 ml rice-wash starter into 1.5 litres of milk', culture: { value: 1.5, unit: 'kg' }, sugar: null, sugarType: null,
    container: 'glass jar', cover: PAPER, location: 'kitchen counter, shaded',
  },
  {
    key: 'b-lucia-imo3', ownerKey: 'lucia', stage: 'IMO3', label: 'IMO3 — from the Fernbrook jar', madeDaysAgo: 6,
    ingredients: 'wheat bran, IMO2 from the Fernbrook lane jar diluted in water', culture: { value: 15, unit: 'kg' }, sugar: null, sugarType: null, moisturePct: 72,
    container: 'heap on the earth floor', cover: STRAW, location: 'the commons barn',
  },
  {
    key: 'b-femi-wca', ownerKey: 'femi', stage: 'WCA', label: 'WCA — shop vinegar', madeDaysAgo: 3,
    ingredients: 'eggshells, toasted and crushed; clear shop vinegar (1.8 kg)', culture: { value: 180, unit: 'g' }, sugar: null, sugarType: null,
    container: 'tall glass jar', cover: PAPER, location: 'cold frame shelf on Tansy row',
  },
];

export const DEMO_CASES: DemoCase[] = [
  // ---------- IMO1 ----------
  {
    key: 'c-imo1-green-corner', batchKey: 'b-kofi-imo1', growerKey: 'kofi', mentorKey: 'tobiah', stage: 'IMO1',
    symptoms: ['colour-bright-green', 'fuzzy-growth', 'colour-white', 'smell-earthy'],
    title: 'Bright green patch on my first IMO1 box',
    description: 'Set 1.5 kg of firm cooked rice in a cedar box under the beeches 5 days ago. Nights about 9 °C, days about 16 °C. Most of it is covered in white fluffy threads and smells like the woods, but one corner has a bright green fuzzy patch about the size of a coin.',
    openedDaysAgo: 335, status: 'recovered',
    cause: 'unwanted-microbes', causeNotes: 'A green mould got a foothold in the one corner where the paper cover had sagged onto the rice and stayed damp.',
    remedy: 'remove-spoiled', remedyNotes: 'Lifted the green patch out with a clean spoon, with a wide margin of white rice around it, wearing a mask. Collected the rest the same day instead of waiting.',
    summary: 'Mostly white IMO1 with one small bright green patch. The patch came out with a wide margin and the box was collected early; the rest went into a quiet IMO2.',
    outcome: 'recovered', stars: 4, recoveryComment: 'The rest stayed white and went into sugar fine. Wish I had known about the wide margin before I started poking at it.', consentToPublish: true,
    messages: [
      { authorKey: 'kofi', kind: 'text', body: 'Photo attached. Is the whole box ruined or just that corner?', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'aside', body: 'First box. Patch is small, the rest looks textbook. Keep it calm.', minutesAfterOpen: 22 },
      { authorKey: 'tobiah', kind: 'text', body: 'Not ruined. White is what you want and most of the box is white. The green is one mould racing ahead. Put a mask on, lift it out with a clean spoon plus a good margin of white around it, and bag it.', minutesAfterOpen: 25 },
      { authorKey: 'tobiah', kind: 'text', body: 'Then I would collect the box today rather than give it more days. Waiting only gives the green another go.', minutesAfterOpen: 27 },
      { authorKey: 'kofi', kind: 'text', body: 'Done. Took out about a handful. The rest smells like mushrooms.', minutesAfterOpen: 95 },
      { authorKey: 'tobiah', kind: 'text', body: 'Perfect. Weigh what is left and mix it with the same weight of brown sugar for IMO2.', minutesAfterOpen: 110 },
    ],
  },
  {
    key: 'c-imo1-rain-rot', batchKey: 'b-hana-imo1', growerKey: 'hana', mentorKey: 'marta', stage: 'IMO1',
    symptoms: ['colour-black', 'colour-pink-red', 'slimy', 'smell-putrid', 'wet-sloppy'],
    title: 'IMO1 after heavy rain: black and pink spots, smells bad',
    description: 'Box of 1 kg cooked rice (cooked quite soft) left 4 days under the hazels. It rained hard two nights running and the rain cover blew off. The rice is wet and collapsing, with black spots and a pink smear, slimy to the touch, and it smells rotten.',
    openedDaysAgo: 296, status: 'lost',
    cause: 'too-wet', causeNotes: 'Soft-cooked rice plus two nights of rain with no cover. Waterlogged rice lets slime bacteria and the wrong moulds win.',
    remedy: 'discard-restart', remedyNotes: 'Tipped it out well away from the beds, with mask and gloves; scrubbed the box and dried it in the sun. Restart with firmer rice and a rain cover weighed down with a stone.',
    summary: 'Rain-soaked IMO1 turned black, pink, slimy and putrid. Discarded, not rescued. Restarted with firmer rice and a weighted rain cover, which came up white.',
    outcome: 'lost', stars: 5, recoveryComment: 'Sad but clear. The second box a week later came up white.', consentToPublish: true,
    messages: [
      { authorKey: 'hana', kind: 'text', body: 'I think I know the answer, but hoping there is a way to save it.', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'I am sorry, this one goes. Black, pink, slimy and a rotten smell together mean the wrong microbes have taken over, and there is no fixing that.', minutesAfterOpen: 18 },
      { authorKey: 'marta', kind: 'text', body: 'Put on a mask and gloves, tip it somewhere away from your vegetable beds, and scrub the box. Next time cook the rice a bit firmer and weigh the rain cover down.', minutesAfterOpen: 20 },
      { authorKey: 'hana', kind: 'text', body: 'Okay. Should I use the same spot?', minutesAfterOpen: 60 },
      { authorKey: 'marta', kind: 'text', body: 'The spot was fine; it was the rain. Same spot, firmer rice, better cover.', minutesAfterOpen: 75 },
    ],
  },
  {
    key: 'c-imo1-dug-up', batchKey: 'b-mateo-imo1', growerKey: 'mateo', mentorKey: 'tobiah', stage: 'IMO1',
    symptoms: ['animal-damage', 'colour-white', 'smell-earthy'],
    title: 'Something dug into my IMO1 box overnight',
    description: 'Second morning check: the box (about 1.2 kg of rice) was tipped on its side, the paper torn, half the rice gone and scratch marks on the wood. The half still in the box has white threads starting and smells fine.',
    openedDaysAgo: 247, status: 'recovered',
    cause: 'pests', causeNotes: 'An animal after the rice itself; the box had no mesh or weight on it.',
    remedy: 'protect-from-pests', remedyNotes: 'Picked out scattered or trampled rice, pressed a fresh paper cover on, laid wire mesh over the box and weighted it with two stones. Collected the remaining half when white covered it.',
    summary: 'An animal tipped an unguarded IMO1 box. The undisturbed half was kept under mesh and collected when white: half the yield, but a clean catch.',
    outcome: 'partly', stars: 4, recoveryComment: 'Got about half a box of good white culture. Mesh from now on.', consentToPublish: false,
    messages: [
      { authorKey: 'mateo', kind: 'text', body: 'Is the half that is left still usable, or has it been spoiled by whatever it was?', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'If it smells fine and the white is coming, keep it. Pick out any rice that was scattered or looks trampled and do not put that back.', minutesAfterOpen: 30 },
      { authorKey: 'tobiah', kind: 'aside', body: 'Could be any digger. Advice is the same either way: mesh and weight.', minutesAfterOpen: 31 },
      { authorKey: 'tobiah', kind: 'text', body: 'Fresh paper on top, then a piece of wire mesh over the whole box, and a couple of stones on the mesh. Check tomorrow.', minutesAfterOpen: 33 },
      { authorKey: 'mateo', kind: 'text', body: 'Nothing touched it last night. The white is spreading.', minutesAfterOpen: 1500 },
    ],
  },
  {
    key: 'c-imo1-dry-crust', batchKey: 'b-signe-imo1', growerKey: 'signe', mentorKey: 'marta', stage: 'IMO1',
    symptoms: ['dry-crusty', 'smell-none'],
    title: 'IMO1 gone dry and crusty, nothing growing',
    description: '1 kg of rice in a shallow box under the pines, 6 days now. It has been dry and sunny, 14–20 °C. The top grains are hard and crusty, no white at all, no smell. The needle litter around it is dry too.',
    openedDaysAgo: 114, status: 'recovered',
    cause: 'too-dry', causeNotes: 'A dry spell, and a spot where the litter was thin and let the sun through.',
    remedy: 'add-water', remedyNotes: 'Misted the rice lightly with clean water, moved the box to deeper, damper leaf litter in shade, and tucked leaves round the sides.',
    summary: 'IMO1 in a dry, exposed spot crusted over and did not grow. Lightly moistened and moved to damper litter, it grew white within three days.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Three days after moving it there was white everywhere.', consentToPublish: true,
    messages: [
      { authorKey: 'signe', kind: 'text', body: 'Should I start again, or is there something to try first?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'Try first. Nothing bad has grown; it is just too dry for anything to grow. Mist it lightly, do not soak it.', minutesAfterOpen: 40 },
      { authorKey: 'marta', kind: 'text', body: 'And move it. Look for a place where the leaves are thick and a little damp underneath and you can see white threads when you lift them. Needle litter is often too thin.', minutesAfterOpen: 42 },
      { authorKey: 'signe', kind: 'text', body: 'Moved it under the oaks further down. Lots of white threads in the litter there.', minutesAfterOpen: 200 },
      { authorKey: 'marta', kind: 'aside', body: 'Ask for a photo on day 3.', minutesAfterOpen: 205 },
      { authorKey: 'marta', kind: 'text', body: 'Good choice. A photo on day three, please.', minutesAfterOpen: 210 },
    ],
  },
  {
    key: 'c-imo1-musty-old', growerKey: 'ollie', mentorKey: 'dunstan', stage: 'IMO1', location: 'the beech hanger above the weir',
    symptoms: ['colour-blue-green', 'colour-dark-grey', 'smell-musty', 'fuzzy-growth'],
    title: 'Blue-green and grey mould, musty smell on IMO1',
    description: 'Left my rice box 10 days, forgot about it in a busy week. It has some white but also blue-green powdery patches and dark grey fuzz. Smells musty, like an old cellar. About 800 g of rice to start.',
    openedDaysAgo: 60, status: 'lost',
    cause: 'kept-too-long', causeNotes: 'Left well past the point where white covered it; other moulds moved in over the white.',
    remedy: 'remove-spoiled', remedyNotes: 'Scooped out the blue-green and grey patches and kept the white parts to mix with sugar.',
    summary: 'IMO1 left 10 days grew blue-green and dark grey patches and smelled musty. Scooping out the patches did not hold: the musty smell stayed and blue-green came back in the IMO2 jar. Discarding at the start would have saved a week.',
    outcome: 'lost', stars: 2, recoveryComment: 'The blue-green came back in the sugar jar within a few days. Threw it all out in the end.', consentToPublish: true,
    messages: [
      { authorKey: 'ollie', kind: 'text', body: 'Can I pick out the good white parts?', minutesAfterOpen: 0 },
      { authorKey: 'dunstan', kind: 'text', body: 'You can try. Mask on, scoop out the coloured patches with a wide margin, and keep only clean white bits.', minutesAfterOpen: 70 },
      { authorKey: 'dunstan', kind: 'aside', body: 'Musty through the whole box worries me. Might not hold.', minutesAfterOpen: 72 },
      { authorKey: 'ollie', kind: 'text', body: 'Done, about half left. Still smells a bit musty.', minutesAfterOpen: 130 },
      { authorKey: 'dunstan', kind: 'text', body: 'Mix it with sugar and watch it closely. If the blue-green shows again, let it go.', minutesAfterOpen: 150 },
    ],
  },

  // ---------- IMO2 ----------
  {
    key: 'c-imo2-half-sugar', batchKey: 'b-priya-imo2', growerKey: 'priya', mentorKey: 'marta', stage: 'IMO2',
    symptoms: ['bubbling', 'smell-alcoholic', 'free-liquid'],
    title: 'IMO2 jar fizzing a week in',
    description: 'Mixed 900 g of IMO1 culture with 450 g of brown sugar (I had read half and half somewhere). Clay crock, paper cover, pantry at about 18 °C. Day 6: little bubbles rising all over the surface, it smells like cider, and there is a bit of syrup at the bottom.',
    openedDaysAgo: 316, status: 'recovered',
    cause: 'too-little-sugar', causeNotes: 'Sugar was half the culture weight. The sugar & water check put it near 0.96, where bacteria, yeasts and moulds can all grow.',
    remedy: 'add-sugar', remedyNotes: 'Mixed in another 450 g of brown sugar to reach equal weights (900 g and 900 g; the check then estimates about 0.91). Next day the bubbles were slowing; still by day 3.',
    summary: 'IMO2 made with sugar at half the culture weight started fermenting. Bringing the sugar up to equal weights stopped it within two days.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Quiet ever since, smells like treacle.', consentToPublish: true,
    messages: [
      { authorKey: 'priya', kind: 'text', body: 'Is the fizzing bad? It smells nice, like cider.', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'It is the jar telling you it has too little sugar. Your check shows about 0.96, which is wet enough for nearly everything to grow. The usual rule is equal weights.', minutesAfterOpen: 12 },
      { authorKey: 'marta', kind: 'text', body: 'Mix in another 450 g of brown sugar so it is 900 and 900, stir it well, paper back on. Look tomorrow; it should slow down.', minutesAfterOpen: 14 },
      { authorKey: 'priya', kind: 'text', body: 'Slower today. Maybe a bubble a minute instead of lots.', minutesAfterOpen: 1480 },
      { authorKey: 'marta', kind: 'text', body: 'That is the right direction. Leave it and look again in two days. If it is still going, top-dress another handful.', minutesAfterOpen: 1500 },
      { authorKey: 'priya', kind: 'text', body: 'Completely still now.', minutesAfterOpen: 4300 },
    ],
  },
  {
    key: 'c-imo2-syrup-pool', batchKey: 'b-nia-imo2', growerKey: 'nia', mentorKey: 'tobiah', stage: 'IMO2',
    symptoms: ['free-liquid', 'wet-sloppy', 'smell-sour'],
    title: 'Pool of liquid in the bottom of my IMO2 jar',
    description: '1.4 kg of culture with 1.4 kg of brown sugar in a glass jar, 9 days ago. The rice was cooked soft and the IMO1 box got damp in the rain, so the culture went in wet (I would guess 75–78 % moisture). Now there is about a cupful of dark syrup at the bottom, the top is wet and sloppy, and there is a slight sour smell.',
    openedDaysAgo: 271, status: 'recovered',
    cause: 'too-wet', causeNotes: 'The culture went in much wetter than cooked rice usually is, so equal weights of sugar were not enough and the extra water came out as syrup.',
    remedy: 'drain-liquid', remedyNotes: 'Poured off about 200 ml of syrup (diluted it onto the compost), then top-dressed 250 g of brown sugar.',
    summary: 'A wet IMO1 culture made a pool of syrup under IMO2. Draining the liquid and top-dressing sugar made it firm and quiet again.',
    outcome: 'recovered', stars: 4, recoveryComment: 'Firmed up in a couple of days. Drain first, then sugar: it worked.', consentToPublish: true,
    messages: [
      { authorKey: 'nia', kind: 'text', body: 'Can I just stir it back in?', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'I would not. That liquid is the extra water the sugar pulled out. Stirring it back puts you where you started. Pour it off.', minutesAfterOpen: 45 },
      { authorKey: 'tobiah', kind: 'aside', body: 'Moisture entered as 77 %; the check says it needs more than equal weights anyway.', minutesAfterOpen: 46 },
      { authorKey: 'tobiah', kind: 'text', body: 'Then sprinkle a layer of sugar over the top, a couple of handfuls. Tell me tomorrow whether more liquid gathered.', minutesAfterOpen: 48 },
      { authorKey: 'nia', kind: 'text', body: 'Hardly any new liquid. Smells sweeter.', minutesAfterOpen: 1460 },
    ],
  },
  {
    key: 'c-imo2-screw-lid', batchKey: 'b-lucia-imo2', growerKey: 'lucia', mentorKey: 'ama', stage: 'IMO2',
    symptoms: ['bubbling', 'smell-alcoholic'],
    title: 'IMO2 jar hissed when I opened it',
    description: '600 g of culture and 600 g of brown sugar in a jar with the screw lid done up, 5 days ago, in a kitchen cupboard at about 20 °C. When I opened it today it hissed, there are bubbles through the mix and it smells strongly of alcohol.',
    openedDaysAgo: 190, status: 'recovered',
    cause: 'poor-air', causeNotes: 'Sealed jar: gas from the first days had nowhere to go and the culture sat in its own fumes.',
    remedy: 'change-cover', remedyNotes: 'Swapped the lid for paper tied with string, stirred once to let the gas out, and moved it to a cooler shelf.',
    summary: 'IMO2 sealed under a screw lid built pressure and smelled of alcohol. Under a breathable paper cover it settled within two days.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Settled down; sweet smell now.', consentToPublish: true,
    messages: [
      { authorKey: 'lucia', kind: 'text', body: 'Is it dangerous? It made quite a noise.', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'The hiss is just gas. A sealed jar cannot breathe, and it can even crack, so no lids that screw down on anything living.', minutesAfterOpen: 15 },
      { authorKey: 'ama', kind: 'aside', body: 'Sugar check is fine at equal weights. It is the lid.', minutesAfterOpen: 16 },
      { authorKey: 'ama', kind: 'text', body: 'Stir it once with a clean spoon, tie paper over the top, and move it somewhere cooler than a kitchen cupboard. Your sugar is right, so that should be all it needs.', minutesAfterOpen: 17 },
      { authorKey: 'lucia', kind: 'text', body: 'Two days on, no bubbles.', minutesAfterOpen: 2900 },
    ],
  },
  {
    key: 'c-imo2-windowsill', batchKey: 'b-femi-imo2', growerKey: 'femi', mentorKey: 'marta', stage: 'IMO2',
    symptoms: ['bubbling', 'smell-sour', 'colour-yellow-orange'],
    title: 'IMO2 foaming on the windowsill',
    description: '2 kg of culture with 2 kg of brown sugar in a big crock on a south windowsill. It reaches about 29–30 °C in the afternoon. After 6 days the top is foaming with yellowish froth and there is a sour edge to the sweet smell.',
    openedDaysAgo: 144, status: 'recovered',
    cause: 'too-warm', causeNotes: 'The sugar was right, but afternoon sun pushed the crock near 30 °C, which speeds everything up.',
    remedy: 'move-cooler', remedyNotes: 'Moved the crock to the pantry floor, about 15 °C, and skimmed off the froth.',
    summary: 'Equal-weights IMO2 foamed in afternoon sun. Moved to a cool pantry floor, it calmed within a day.',
    outcome: 'recovered', stars: 4, recoveryComment: 'Calmed right down. The smell is sweet again.', consentToPublish: true,
    messages: [
      { authorKey: 'femi', kind: 'text', body: 'The sugar is one to one, so I do not understand why it is foaming.', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'Your sugar is fine. The heat is not. At 30 degrees even a well-sugared culture gets busy. Keep it somewhere cool and steady, out of the sun.', minutesAfterOpen: 35 },
      { authorKey: 'femi', kind: 'text', body: 'The pantry floor is the coolest place, about 15.', minutesAfterOpen: 40 },
      { authorKey: 'marta', kind: 'text', body: 'Perfect. Skim the froth, move it there, and look tomorrow.', minutesAfterOpen: 45 },
      { authorKey: 'femi', kind: 'text', body: 'Barely any froth today.', minutesAfterOpen: 1450 },
    ],
  },
  {
    key: 'c-imo2-waited-too-long', batchKey: 'b-yusuf-imo2', growerKey: 'yusuf', mentorKey: 'dunstan', stage: 'IMO2',
    symptoms: ['bubbling', 'smell-sweet', 'smell-sour'],
    title: 'IMO2 bubbling: is this normal fermentation?',
    description: '2 lb of IMO1 culture and 1 lb of brown sugar in a ceramic crock, 5 days ago, in the shed at around 16 °C. Small bubbles on the surface; the smell is sweet but a bit sour.',
    openedDaysAgo: 225, status: 'lost',
    cause: 'too-little-sugar', causeNotes: 'Sugar was half the culture weight. Waiting gave the fermentation time to run; within a week it turned putrid.',
    remedy: 'wait-and-watch', remedyNotes: 'Advised waiting a few days to see whether it settled. It did not.',
    summary: 'IMO2 with sugar at half the culture weight was left to settle and went putrid within a week. Bubbling in a stored IMO2 is not something to wait out: bring the sugar up to equal weights on the first day.',
    outcome: 'lost', stars: 2, recoveryComment: 'It got worse and ended up smelling rotten. Had to throw it out.', consentToPublish: true,
    messages: [
      { authorKey: 'yusuf', kind: 'text', body: 'Photos attached. Bubbles are small but steady.', minutesAfterOpen: 0 },
      { authorKey: 'dunstan', kind: 'text', body: 'Some activity in the first days can settle. Give it three or four days and see.', minutesAfterOpen: 120 },
      { authorKey: 'yusuf', kind: 'text', body: 'Worse. Now it smells off, kind of rotten.', minutesAfterOpen: 4400 },
      { authorKey: 'dunstan', kind: 'aside', body: 'Should have flagged the 1 lb to 2 lb ratio on day one. Lesson for me.', minutesAfterOpen: 4410 },
      { authorKey: 'dunstan', kind: 'text', body: 'I am sorry; with a rotten smell it has to go. Next time use equal weights of sugar from the start, and if it bubbles, add sugar rather than wait.', minutesAfterOpen: 4420 },
    ],
  },
  {
    key: 'c-imo2-brown-sticky', batchKey: 'b-della-imo2', growerKey: 'della', mentorKey: 'keiko', stage: 'IMO2',
    symptoms: ['colour-brown', 'smell-sweet', 'clumped'],
    title: 'IMO2 turned dark brown and sticky',
    description: '1 kg of culture with 1 kg of raw sugar, 3 weeks ago, in the cellar at about 12 °C. The white has gone; it is dark brown and sticky with some clumps. Smells sweet, like dates. Is the culture dead?',
    openedDaysAgo: 80, status: 'recovered',
    cause: 'normal-change', causeNotes: 'Sugar darkens the culture and the white threads disappear into the syrup. This is what a resting IMO2 looks like.',
    remedy: 'wait-and-watch', remedyNotes: 'Left it in the cellar under its paper cover.',
    summary: 'IMO2 went dark brown and sticky with a sweet smell. Normal for the stage; left as it was, and it grew white again on bran a month later.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Used it for IMO3 a month later and it grew white beautifully.', consentToPublish: true,
    messages: [
      { authorKey: 'della', kind: 'text', body: 'It looked so lively when it was white. Did I kill it?', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'Not dead, resting. That is exactly what a good IMO2 looks and smells like. The white threads do not stay visible once the sugar draws the water out.', minutesAfterOpen: 50 },
      { authorKey: 'keiko', kind: 'aside', body: 'Textbook jar. Reassure; nothing to do.', minutesAfterOpen: 51 },
      { authorKey: 'keiko', kind: 'text', body: 'Keep it in the cellar with the paper on and leave it. It wakes up when you dilute it for bran.', minutesAfterOpen: 53 },
      { authorKey: 'della', kind: 'text', body: 'Phew. Thank you.', minutesAfterOpen: 80 },
    ],
  },
  {
    key: 'c-imo2-pounds', batchKey: 'b-wilf-imo2', growerKey: 'wilf', mentorKey: 'dunstan', stage: 'IMO2',
    symptoms: ['bubbling', 'smell-alcoholic'],
    title: 'Froth on an IMO2 made in pounds',
    description: 'Weighed 1.5 lb of IMO1 culture and mixed it with 1 lb of brown sugar, 6 days ago, in a wide-mouth glass jar in the garage at about 17 °C. Light froth round the edge and a yeasty smell.',
    openedDaysAgo: 39, status: 'recovered',
    cause: 'too-little-sugar', causeNotes: '1 lb of sugar to 1.5 lb of culture is two-thirds of equal weights.',
    remedy: 'add-sugar', remedyNotes: 'Added 8 oz of brown sugar to bring it to 1.5 lb and 1.5 lb, mixed through. With the jar zeroed, the scale read 3 lb.',
    summary: 'IMO2 at two-thirds of equal weights started to froth. Topping the sugar up by 8 oz to equal weights stopped it the next day.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Stopped overnight.', consentToPublish: true,
    messages: [
      { authorKey: 'wilf', kind: 'text', body: 'Hope pounds are all right; my scale does not do grams.', minutesAfterOpen: 0 },
      { authorKey: 'dunstan', kind: 'text', body: 'Pounds are fine; the check converts them. You are short: equal weights means 1.5 lb of sugar for 1.5 lb of culture. Add another 8 oz and mix it in well.', minutesAfterOpen: 25 },
      { authorKey: 'dunstan', kind: 'text', body: 'With the jar zeroed on the scale, the mix should read 3 lb when you are done.', minutesAfterOpen: 27 },
      { authorKey: 'wilf', kind: 'text', body: 'No froth this morning.', minutesAfterOpen: 1400 },
    ],
  },

  // ---------- IMO3 ----------
  {
    key: 'c-imo3-ammonia-wet', batchKey: 'b-benedikt-imo3', growerKey: 'benedikt', mentorKey: 'tobiah', stage: 'IMO3',
    symptoms: ['smell-ammonia', 'wet-sloppy', 'clumped'],
    title: 'Bran pile smells of ammonia and feels soggy',
    description: '20 kg of wheat bran wetted with diluted IMO2 on the barn’s earth floor, 5 days ago, under straw. The middle of the pile reads 52 °C. Strong ammonia smell when I lift the straw, and a squeezed handful drips water. The clumps are dark and sticky.',
    openedDaysAgo: 165, status: 'recovered',
    cause: 'too-wet', causeNotes: 'Too much liquid at mixing (the squeeze test dripped); the wet pile ran hot at 52 °C and started losing nitrogen as ammonia.',
    remedy: 'add-dry-matter', remedyNotes: 'Turned the whole pile, mixed in about 4 kg of dry bran until a squeezed handful held without dripping, and spread it lower. Turned again the next day.',
    summary: 'An over-wet IMO3 bran pile ran hot (52 °C) and smelled of ammonia. Turning in dry bran to the squeeze-test point and spreading it lower brought it back to white and earthy within three days.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Ammonia gone in two days, white all through by day four.', consentToPublish: true,
    messages: [
      { authorKey: 'benedikt', kind: 'text', body: 'Numbers are in the case. I think I overdid the water.', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'A classic wet pile: ammonia, drips and heat. Too much water went in at mixing.', minutesAfterOpen: 20 },
      { authorKey: 'tobiah', kind: 'text', body: 'Turn it all today and mix in dry bran a bit at a time until a squeezed handful holds, no water comes out, and it breaks up when you poke it. Spread it lower so it cools; we keep piles under about 49 °C.', minutesAfterOpen: 22 },
      { authorKey: 'tobiah', kind: 'aside', body: 'Has made piles before; no need for basics.', minutesAfterOpen: 23 },
      { authorKey: 'benedikt', kind: 'text', body: 'Used about 4 kg of dry bran. Down to 44 °C tonight.', minutesAfterOpen: 300 },
      { authorKey: 'tobiah', kind: 'text', body: 'Good. Turn it again tomorrow and keep an eye on the smell.', minutesAfterOpen: 320 },
    ],
  },
  {
    key: 'c-imo3-sun-hot', batchKey: 'b-greta-imo3', growerKey: 'greta', mentorKey: 'tobiah', stage: 'IMO3',
    symptoms: ['colour-light-grey', 'smell-ammonia', 'dry-crusty'],
    title: 'IMO3 pile getting very hot, grey in the middle',
    description: 'About 15 kg rice bran pile under a plastic sheet on the sunny side of the polytunnels, 4 days old. The thermometer says 55 °C in the core. The outer layer is white; the core has gone grey and dry, with a faint ammonia smell.',
    openedDaysAgo: 126, status: 'recovered',
    cause: 'too-warm', causeNotes: 'Pile in full sun under plastic; the core overheated well past the usual limit and cooked the white growth.',
    remedy: 'move-cooler', remedyNotes: 'Moved the pile into the barn’s shade, swapped the plastic for straw, spread it lower and turned it twice a day until it stayed under 45 °C.',
    summary: 'An IMO3 pile in sun under plastic overheated to 55 °C and its core went grey and dry. Moving it into shade and spreading it out saved the outer layers; the core never came back.',
    outcome: 'partly', stars: 3, recoveryComment: 'The outer half was fine; the middle stayed grey and went to the compost.', consentToPublish: true,
    messages: [
      { authorKey: 'greta', kind: 'text', body: 'Is 55 too hot?', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: '55 is too hot. Above about 49 the good moulds start to cook. Get it out of the sun and take the plastic off today.', minutesAfterOpen: 60 },
      { authorKey: 'greta', kind: 'text', body: 'Can I just water it to cool it down?', minutesAfterOpen: 70 },
      { authorKey: 'tobiah', kind: 'text', body: 'No, water will make it soggy and smelly. Move it to shade, spread it lower and turn it; that cools it. Only a light sprinkle where it is dry and crusty.', minutesAfterOpen: 80 },
      { authorKey: 'greta', kind: 'text', body: 'Down to 46. The core is still grey though.', minutesAfterOpen: 1500 },
      { authorKey: 'tobiah', kind: 'text', body: 'The grey part may not come back. Keep the white parts going and compost the grey if it stays that way.', minutesAfterOpen: 1520 },
    ],
  },
  {
    key: 'c-imo3-too-dry', batchKey: 'b-tomasz-imo3', growerKey: 'tomasz', mentorKey: 'marta', stage: 'IMO3',
    symptoms: ['dry-crusty', 'smell-none'],
    title: 'Bran pile not doing anything, top is crusty',
    description: '10 kg of bran wetted with diluted IMO2, 4 days on a concrete floor. No warmth in the middle, no white, no smell. The top is dry and crusty. I think I did not use enough water: a squeezed handful does not hold together.',
    openedDaysAgo: 92, status: 'recovered',
    cause: 'too-dry', causeNotes: 'Too little liquid at mixing (the squeeze test crumbled), and the concrete floor and a dry shed drew moisture out.',
    remedy: 'add-water', remedyNotes: 'Sprinkled more diluted IMO2 while turning until a squeezed handful held together, then covered it with damp sacking.',
    summary: 'A dry IMO3 bran pile did not start. Moistened to the squeeze-test point and covered with sacking, it was warm and white in three days.',
    outcome: 'recovered', stars: 4, recoveryComment: 'Worked: warm the next day, white after three. I will move it off concrete next time.', consentToPublish: true,
    messages: [
      { authorKey: 'tomasz', kind: 'text', body: 'Should I add more culture or just water?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'It sounds too dry to start. Sprinkle in more of your diluted IMO2 while you turn it, a little at a time, until a squeezed handful holds together and then crumbles when you poke it.', minutesAfterOpen: 90 },
      { authorKey: 'marta', kind: 'text', body: 'Cover it with damp sacking, not plastic. And next time, put it on an earth floor if you can; concrete pulls moisture out.', minutesAfterOpen: 92 },
      { authorKey: 'tomasz', kind: 'text', body: 'Warm in the middle this morning!', minutesAfterOpen: 1450 },
    ],
  },
  {
    key: 'c-imo3-mice', batchKey: 'b-sami-imo3', growerKey: 'sami', mentorKey: 'ama', stage: 'IMO3',
    symptoms: ['animal-damage', 'colour-white', 'smell-earthy'],
    title: 'Mice tunnelling through the IMO3 pile',
    description: '12 kg bran pile in the barn, a week old, lovely white and earthy. This morning there are tunnels and droppings along one side.',
    openedDaysAgo: 255, status: 'recovered',
    cause: 'pests', causeNotes: 'Mice came for the bran; nothing covered the pile but straw.',
    remedy: 'protect-from-pests', remedyNotes: 'Removed the side with tunnels and droppings (mask and gloves), then set a wire-mesh frame over the straw.',
    summary: 'Mice found a healthy IMO3 pile. Removing the soiled side and covering the pile with a wire-mesh frame kept them out; the rest finished well.',
    outcome: 'recovered', stars: 4, recoveryComment: 'No more tunnels. Lost one side, the rest was perfect.', consentToPublish: true,
    messages: [
      { authorKey: 'sami', kind: 'text', body: 'Is it still all right to use?', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'Take out the side with the tunnels and droppings, generously, with a mask and gloves on. Droppings are not something you want spread on beds.', minutesAfterOpen: 30 },
      { authorKey: 'ama', kind: 'text', body: 'Then put a wire-mesh frame over the whole pile, on top of the straw. The rest sounds healthy.', minutesAfterOpen: 32 },
      { authorKey: 'sami', kind: 'text', body: 'No new tunnels.', minutesAfterOpen: 1500 },
    ],
  },
  {
    key: 'c-imo3-plastic-green', batchKey: 'b-clementine-imo3', growerKey: 'clementine', mentorKey: 'marta', stage: 'IMO3',
    symptoms: ['colour-bright-green', 'colour-yellow-orange', 'fuzzy-growth'],
    title: 'Green patches where the plastic touches the bran',
    description: '8 kg bran pile covered with a plastic sheet laid right on top, 5 days. Water droplets under the plastic, bright green fuzzy patches where it touches, some yellow-orange spots, and white growth underneath.',
    openedDaysAgo: 66, status: 'recovered',
    cause: 'poor-air', causeNotes: 'Plastic laid directly on the pile trapped condensation; the dripping, airless surface let a green mould take hold.',
    remedy: 'change-cover', remedyNotes: 'Took off the plastic, lifted out the green patches, and covered the pile with straw and a cotton sheet.',
    summary: 'Plastic laid on an IMO3 pile trapped condensation and grew green patches. With a straw and cotton cover (and the patches removed) the white took over again.',
    outcome: 'recovered', stars: 4, recoveryComment: 'White all through by the end of the week.', consentToPublish: true,
    messages: [
      { authorKey: 'clementine', kind: 'text', body: 'Photo of the underside of the plastic attached. It is dripping.', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'The plastic is the problem. It sweats onto the bran and stops air getting in, and green moulds love that. The yellow spots are usually harmless.', minutesAfterOpen: 25 },
      { authorKey: 'marta', kind: 'text', body: 'Mask on, lift out the green patches, then cover it with straw and a cloth sheet, something that breathes.', minutesAfterOpen: 27 },
      { authorKey: 'marta', kind: 'aside', body: 'Check it is not in sun as well.', minutesAfterOpen: 28 },
      { authorKey: 'marta', kind: 'text', body: 'Is it in the shade?', minutesAfterOpen: 30 },
      { authorKey: 'clementine', kind: 'text', body: 'Yes, inside the barn. No new green today.', minutesAfterOpen: 1500 },
    ],
  },

  // ---------- IMO4 ----------
  {
    key: 'c-imo4-roof-leak', batchKey: 'b-orla-imo4', growerKey: 'orla', mentorKey: 'tobiah', stage: 'IMO4',
    symptoms: ['wet-sloppy', 'free-liquid', 'smell-sour'],
    title: 'IMO4 soaked after the barn roof leaked',
    description: 'IMO3 mixed with field soil about half and half, roughly 30 kg in all, a week ago. The roof leaked in the storm; one end is sloppy, water is pooling underneath, and it smells sour.',
    openedDaysAgo: 236, status: 'recovered',
    cause: 'too-wet', causeNotes: 'Rainwater from the leak waterlogged one end of the heap.',
    remedy: 'add-dry-matter', remedyNotes: 'Shovelled the soaked end aside, mixed dry soil and bran into it until it passed the squeeze test, and moved the whole heap away from the leak.',
    summary: 'A roof leak waterlogged one end of an IMO4 heap. Dry soil and bran saved the drier end; the wettest part stayed sour and went onto a resting bed, not food beds.',
    outcome: 'partly', stars: 3, recoveryComment: 'The dry end smelled good and went out on the beds. The wet end never lost its sour smell.', consentToPublish: false,
    messages: [
      { authorKey: 'orla', kind: 'text', body: 'How much of this can I save?', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'Move the heap out from under the leak first. Then shovel the soaked end to one side and work dry soil and some dry bran into it until the squeeze test is right.', minutesAfterOpen: 40 },
      { authorKey: 'tobiah', kind: 'text', body: 'Keep the drier end apart so it does not get wet again. Turn both tomorrow and smell them.', minutesAfterOpen: 42 },
      { authorKey: 'orla', kind: 'text', body: 'The dry end smells good. The wet end is still sour.', minutesAfterOpen: 1600 },
      { authorKey: 'tobiah', kind: 'text', body: 'Spread the sour part on a bed that is resting, not on food, and use the rest.', minutesAfterOpen: 1620 },
    ],
  },
  {
    key: 'c-imo4-wind-dried', batchKey: 'b-ravi-imo4', growerKey: 'ravi', mentorKey: 'dunstan', stage: 'IMO4',
    symptoms: ['dry-crusty', 'clumped', 'smell-none'],
    title: 'IMO4 dried to a crust',
    description: 'IMO3 and soil from the lower field, about 20 kg, heaped in the open under one sack. Five dry, windy days. The top is a hard crust, there are clumps inside, and it has no smell at all.',
    openedDaysAgo: 105, status: 'recovered',
    cause: 'too-dry', causeNotes: 'Wind and a single sack dried the heap out.',
    remedy: 'add-water', remedyNotes: 'Broke up the clumps, sprinkled water while turning to the squeeze-test point, covered with two layers of damp sacking and moved it out of the wind.',
    summary: 'An IMO4 heap dried out in the wind. Moistened while breaking up the clumps and covered better, it smelled earthy again in two days.',
    outcome: 'recovered', stars: 4, recoveryComment: 'The earthy smell came back on the second day.', consentToPublish: true,
    messages: [
      { authorKey: 'ravi', kind: 'text', body: 'Is it dead or just dry?', minutesAfterOpen: 0 },
      { authorKey: 'dunstan', kind: 'text', body: 'Most likely just dry. Break up the crust and clumps and sprinkle water as you turn it, until a handful holds when squeezed. Do not soak it.', minutesAfterOpen: 55 },
      { authorKey: 'dunstan', kind: 'text', body: 'Two layers of damp sacking, and move it somewhere out of the wind.', minutesAfterOpen: 57 },
      { authorKey: 'ravi', kind: 'text', body: 'The earthy smell is back.', minutesAfterOpen: 2900 },
    ],
  },
  {
    key: 'c-imo4-grubs', batchKey: 'b-benedikt-imo4', growerKey: 'benedikt', mentorKey: 'marta', stage: 'IMO4',
    symptoms: ['insects', 'smell-earthy', 'colour-white'],
    title: 'Grubs and beetles in IMO4',
    description: 'My IMO4 (last month’s IMO3 with equal parts soil from the upper terraces) is 5 days old. Lovely earthy smell, white threads, but it is full of small white grubs, earthworms and beetles.',
    openedDaysAgo: 153, status: 'recovered',
    cause: 'normal-change', causeNotes: 'Soil creatures moving into a healthy IMO4 are expected; it shows the culture is joining the soil life.',
    remedy: 'wait-and-watch', remedyNotes: 'Left them in and used the IMO4 on schedule.',
    summary: 'Grubs, worms and beetles in a healthy, earthy IMO4. A normal sign at this stage; left as it was and used on schedule.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Went out on the beds on time. Good to know.', consentToPublish: true,
    messages: [
      { authorKey: 'benedikt', kind: 'text', body: 'Do I need to pick them out?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'No, leave them. At IMO4 the point is to join your culture with the soil and everything that lives in it. Creatures moving in is a good sign.', minutesAfterOpen: 30 },
      { authorKey: 'marta', kind: 'text', body: 'It would be different with maggots in something meaty, or insects in a sugar jar. Not here.', minutesAfterOpen: 32 },
      { authorKey: 'benedikt', kind: 'text', body: 'Great, thanks.', minutesAfterOpen: 50 },
    ],
  },

  // ---------- FPJ ----------
  {
    key: 'c-fpj-drain-smell', batchKey: 'b-bea-fpj', growerKey: 'bea', mentorKey: 'ama', stage: 'FPJ',
    symptoms: ['smell-putrid', 'slimy', 'colour-black'],
    title: 'FPJ smells like a drain',
    description: '1 kg of comfrey and dock leaves, washed and still wet, packed tight with 400 g of brown sugar in a bucket with the lid pressed on, 5 days ago. Now it smells rotten, like a sewer. There is a black slimy layer on top and the liquid is stringy.',
    openedDaysAgo: 315, status: 'lost',
    cause: 'too-little-sugar', causeNotes: 'Sugar at 40 % of the plant weight, on washed, wet leaves packed tight under a lid: too much water and too little sugar, so rot bacteria won.',
    remedy: 'discard-restart', remedyNotes: 'Discarded away from the beds; scrubbed the bucket. Restart with unwashed young tips picked in the morning, an equal weight of sugar, packed loosely under paper.',
    summary: 'FPJ from washed, wet leaves with sugar at 40 % of the plant weight went putrid, black and slimy. Discarded. The second batch, with equal weights on dry, unwashed tips, came out sweet.',
    outcome: 'lost', stars: 4, recoveryComment: 'The second batch with the full sugar smelled lovely.', consentToPublish: true,
    messages: [
      { authorKey: 'bea', kind: 'text', body: 'Can I add more sugar to fix it?', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'I am afraid that one goes. A rotten smell, black slime and stringy liquid mean it is putrefying, not fermenting, and sugar will not turn it back.', minutesAfterOpen: 20 },
      { authorKey: 'ama', kind: 'aside', body: 'Beginner. Explain equal weights gently.', minutesAfterOpen: 21 },
      { authorKey: 'ama', kind: 'text', body: 'For next time: do not wash the leaves, pick young tips in the morning, and use the same weight of sugar as leaves, so 1 kg of leaves gets 1 kg of sugar. Pack it loosely and cover with paper, not a lid.', minutesAfterOpen: 24 },
      { authorKey: 'bea', kind: 'text', body: 'Okay. Binned it. Will try again this week.', minutesAfterOpen: 200 },
    ],
  },
  {
    key: 'c-fpj-white-film', batchKey: 'b-emrys-fpj', growerKey: 'emrys', mentorKey: 'keiko', stage: 'FPJ',
    symptoms: ['colour-white', 'fuzzy-growth', 'smell-sweet'],
    title: 'White film on top of my FPJ',
    description: 'FPJ from nettle tops, 800 g with 800 g of brown sugar, day 6. Lots of liquid, smells sweet and a bit winey. Today a thin, wrinkly white film has formed on the surface, with a few fuzzy spots.',
    openedDaysAgo: 285, status: 'recovered',
    cause: 'unwanted-microbes', causeNotes: 'A surface yeast film, usually harmless, helped along by the paper cover sagging onto the liquid.',
    remedy: 'remove-spoiled', remedyNotes: 'Skimmed the film off with a clean spoon, retied the cover tight, strained on day 7 as planned and bottled with a loose cap.',
    summary: 'A thin white film on a sweet-smelling FPJ. Skimmed off and strained on schedule; the juice stayed clean.',
    outcome: 'recovered', stars: 4, recoveryComment: 'No film in the bottle, smells clean.', consentToPublish: true,
    messages: [
      { authorKey: 'emrys', kind: 'text', body: 'Is a white film the good kind of white or the bad kind?', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'If it smells sweet and winey underneath, it is most likely a surface yeast. Skim it off with a clean spoon. Check your paper is not touching the liquid.', minutesAfterOpen: 40 },
      { authorKey: 'emrys', kind: 'text', body: 'It was sagging in the middle.', minutesAfterOpen: 50 },
      { authorKey: 'keiko', kind: 'text', body: 'Retie it tight. You are due to strain tomorrow anyway, so strain and bottle then.', minutesAfterOpen: 55 },
      { authorKey: 'emrys', kind: 'text', body: 'Strained. Smells clean, no film in the bottle.', minutesAfterOpen: 1500 },
    ],
  },
  {
    key: 'c-fpj-forgotten', batchKey: 'b-juniper-fpj', growerKey: 'juniper', mentorKey: 'dunstan', stage: 'FPJ',
    symptoms: ['bubbling', 'smell-alcoholic'],
    title: 'Forgot to strain my FPJ, now fizzy and boozy',
    description: 'FPJ from 600 g of pumpkin vine tips and 600 g of brown sugar, made nearly three weeks ago and never strained. It is fizzing and smells strongly of alcohol.',
    openedDaysAgo: 180, status: 'recovered',
    cause: 'kept-too-long', causeNotes: 'Left unstrained for about three weeks instead of about one; the yeasts kept turning the sugar to alcohol.',
    remedy: 'use-now', remedyNotes: 'Strained it, diluted it about 1 to 500 and used it on the flower borders and young fruit trees over the next week rather than storing it.',
    summary: 'FPJ left unstrained for three weeks turned fizzy and alcoholic. Strained and used up promptly, diluted; the plants were fine, but the juice had lost most of its sweetness.',
    outcome: 'partly', stars: 3, recoveryComment: 'Used it up and the plants were fine, but I do not think it did much.', consentToPublish: true,
    messages: [
      { authorKey: 'juniper', kind: 'text', body: 'Is it still good for anything?', minutesAfterOpen: 0 },
      { authorKey: 'dunstan', kind: 'text', body: 'Probably still usable, but it will not keep now. Strain it today, dilute it well, about 1 to 500, and use it up over the next week.', minutesAfterOpen: 35 },
      { authorKey: 'juniper', kind: 'text', body: 'Should I add more sugar so I can store it?', minutesAfterOpen: 45 },
      { authorKey: 'dunstan', kind: 'text', body: 'Not worth it at this point. Just use it.', minutesAfterOpen: 60 },
      { authorKey: 'dunstan', kind: 'aside', body: 'Long-kept juice; be honest that it may have lost most of its value.', minutesAfterOpen: 61 },
    ],
  },
  {
    key: 'c-fpj-fruit-flies', batchKey: 'b-meilin-fpj', growerKey: 'meilin', mentorKey: 'ama', stage: 'FPJ',
    symptoms: ['insects', 'smell-sweet', 'smell-sour'],
    title: 'Fruit flies all over my FPJ jar',
    description: 'FPJ of 1 kg of squash vine tips with 1 kg of brown sugar, 3 days old, on the porch. A cloud of fruit flies around the jar and some in the liquid under the paper. Smells sweet-sour.',
    openedDaysAgo: 137, status: 'recovered',
    cause: 'pests', causeNotes: 'The paper was held by a rubber band that had loosened, leaving a gap at the rim; the sweet smell drew fruit flies.',
    remedy: 'protect-from-pests', remedyNotes: 'Skimmed out the flies, replaced the paper with a double layer of cloth tied tight with string under the rim, and moved the jar indoors.',
    summary: 'A loose cover let fruit flies into a fresh FPJ. A tight double cloth cover and a move indoors kept them out; the juice finished normally.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Not one fly since, and the juice came out sweet.', consentToPublish: true,
    messages: [
      { authorKey: 'meilin', kind: 'text', body: 'There are so many of them. Is the juice spoiled?', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'Not spoiled. Fruit flies find any gap. Skim them out, then put on a fresh cover, two layers of cloth or paper, tied tight under the rim with string rather than a band that loosens.', minutesAfterOpen: 25 },
      { authorKey: 'ama', kind: 'text', body: 'Bring it inside if you can.', minutesAfterOpen: 27 },
      { authorKey: 'meilin', kind: 'text', body: 'Not one fly today.', minutesAfterOpen: 1440 },
    ],
  },
  {
    key: 'c-fpj-short-sugar', batchKey: 'b-aurelio-fpj', growerKey: 'aurelio', mentorKey: 'marta', stage: 'FPJ',
    symptoms: ['free-liquid', 'bubbling', 'smell-sour'],
    title: 'FPJ frothing and sour on day 2',
    description: '1.2 kg of nettle and chickweed tips with 700 g of brown sugar (I ran out). Crock in the shed, about 15 °C. Day 2: a lot of liquid already, froth on top, and it smells sour rather than sweet.',
    openedDaysAgo: 53, status: 'recovered',
    cause: 'too-little-sugar', causeNotes: 'Sugar at about 58 % of the plant weight.',
    remedy: 'add-sugar', remedyNotes: 'Mixed in another 500 g of brown sugar to reach 1.2 kg and 1.2 kg. The froth died back the next day; strained on day 7.',
    summary: 'Short-sugared FPJ (700 g of sugar for 1.2 kg of plants) frothed and soured by day 2. Making the sugar up to equal weights calmed it overnight, and it strained sweet on day 7.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Sweet and dark when I strained it.', consentToPublish: true,
    messages: [
      { authorKey: 'aurelio', kind: 'text', body: 'Is this much liquid on day two normal?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'Liquid on day two is fine; that is the juice coming out. The sour smell and the froth say it needs its full sugar.', minutesAfterOpen: 15 },
      { authorKey: 'marta', kind: 'text', body: 'You want 1.2 kg of sugar for 1.2 kg of plants. Add 500 g more, stir gently, cover, and look tomorrow.', minutesAfterOpen: 17 },
      { authorKey: 'aurelio', kind: 'text', body: 'Got more sugar. Done.', minutesAfterOpen: 30 },
      { authorKey: 'aurelio', kind: 'text', body: 'Froth gone, smells sweet.', minutesAfterOpen: 1470 },
      { authorKey: 'marta', kind: 'text', body: 'Lovely. Strain it on day seven.', minutesAfterOpen: 1480 },
    ],
  },

  // ---------- FFJ ----------
  {
    key: 'c-ffj-ants', batchKey: 'b-adaeze-ffj', growerKey: 'adaeze', mentorKey: 'ama', stage: 'FFJ',
    symptoms: ['insects', 'smell-sweet'],
    title: 'Ants marching into my fruit juice bucket',
    description: '2 kg of ripe plums and 2 kg of brown sugar in a food-grade bucket on the back step, 2 days old. A trail of ants runs up the side and under the cloth cover. It smells sweet and fruity.',
    openedDaysAgo: 88, status: 'recovered',
    cause: 'pests', causeNotes: 'Ants found the sweet smell and climbed straight up the bucket.',
    remedy: 'protect-from-pests', remedyNotes: 'Fished out the ants, wiped the outside, retied the cover tightly, and stood the bucket in a wider tray of water as a moat, topped up daily.',
    summary: 'Ants found a sweet FFJ bucket. A water moat under the bucket and a retied cover stopped them the same day.',
    outcome: 'recovered', stars: 5, recoveryComment: 'The moat works. Not an ant since.', consentToPublish: true,
    messages: [
      { authorKey: 'adaeze', kind: 'text', body: 'Do I have to throw it out?', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'No! Ants are just hungry. Fish out any that got in, wipe the outside and retie the cover tight.', minutesAfterOpen: 20 },
      { authorKey: 'ama', kind: 'text', body: 'Then stand the bucket in a wider tray of water so they would have to swim. Keep it topped up.', minutesAfterOpen: 22 },
      { authorKey: 'adaeze', kind: 'text', body: 'Moat in place. The ants have given up.', minutesAfterOpen: 300 },
    ],
  },
  {
    key: 'c-ffj-pink-slime', batchKey: 'b-pim-ffj', growerKey: 'pim', mentorKey: 'keiko', stage: 'FFJ',
    symptoms: ['colour-pink-red', 'slimy', 'smell-putrid'],
    title: 'Pink slimy film on my fruit juice',
    description: '1.5 kg of windfall apples (some soft and brown) with 1 kg of white sugar, 10 days ago. A pink slimy film across the top, the liquid is ropey, and it smells rotten, not fruity.',
    openedDaysAgo: 154, status: 'lost',
    cause: 'unwanted-microbes', causeNotes: 'Rotting windfalls brought in spoilage organisms, and short sugar (1 kg for 1.5 kg of fruit) let them take hold.',
    remedy: 'discard-restart', remedyNotes: 'Discarded away from the beds; bucket scrubbed with hot water and dried in the sun. Restart with sound fruit and an equal weight of sugar.',
    summary: 'FFJ from half-rotten windfalls with short sugar grew a pink slimy film and smelled putrid. Discarded; restarted with sound fruit and equal weights.',
    outcome: 'lost', stars: 4, recoveryComment: 'The new batch with good apples is fine.', consentToPublish: true,
    messages: [
      { authorKey: 'pim', kind: 'text', body: 'Can I skim the pink off?', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'Pink, slimy and rotten together is a definite discard, sorry. A skim will not fix it.', minutesAfterOpen: 30 },
      { authorKey: 'keiko', kind: 'text', body: 'Mask and gloves, pour it away from your beds, and scrub the bucket. Next time use sound fruit (bruised is fine, rotten is not) and an equal weight of sugar.', minutesAfterOpen: 32 },
      { authorKey: 'keiko', kind: 'aside', body: 'White sugar was not the cause; do not muddle the advice with it.', minutesAfterOpen: 33 },
      { authorKey: 'pim', kind: 'text', body: 'Thanks. Done.', minutesAfterOpen: 120 },
    ],
  },
  {
    key: 'c-ffj-stove', batchKey: 'b-ffion-ffj', growerKey: 'ffion', mentorKey: 'marta', stage: 'FFJ',
    symptoms: ['bubbling', 'smell-alcoholic', 'colour-yellow-orange'],
    title: 'FFJ foaming over, smells like strong wine',
    description: '1.5 kg of ripe pears and 1.5 kg of brown sugar in a jar next to the wood stove, about 28 °C. Day 3, and yellow-orange foam is rising to the cover with a very strong alcohol smell.',
    openedDaysAgo: 72, status: 'recovered',
    cause: 'too-warm', causeNotes: 'Fruit ferments fast anyway; beside the stove at 28 °C it ran away.',
    remedy: 'move-cooler', remedyNotes: 'Moved it to an unheated back room (about 14 °C), skimmed the foam, and strained two days earlier than planned.',
    summary: 'FFJ next to a stove fermented hard and foamed over. In a cool room it settled; strained early, it kept well.',
    outcome: 'recovered', stars: 4, recoveryComment: 'Much calmer in the back room, and the juice kept well.', consentToPublish: true,
    messages: [
      { authorKey: 'ffion', kind: 'text', body: 'The foam is nearly touching the paper.', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'Your sugar is right; the stove is not. Fruit ferments fast anyway, and at 28 degrees it runs away.', minutesAfterOpen: 20 },
      { authorKey: 'marta', kind: 'text', body: 'Move it to the coolest room you have, skim the foam, and plan to strain it a bit early.', minutesAfterOpen: 22 },
      { authorKey: 'ffion', kind: 'text', body: 'Much calmer in the back room.', minutesAfterOpen: 1450 },
    ],
  },
  {
    key: 'c-ffj-lid-off', batchKey: 'b-lars-ffj', growerKey: 'lars', mentorKey: 'tobiah', stage: 'FFJ',
    symptoms: ['animal-damage', 'free-liquid'],
    title: 'Something knocked the cover off my fruit ferment',
    description: 'FFJ of 3 kg of blackberries and 3 kg of brown sugar in a bucket in the lean-to. Overnight the cover was pulled off, fruit scattered, paw prints everywhere, and juice spilled round the bucket.',
    openedDaysAgo: 33, status: 'recovered',
    cause: 'pests', causeNotes: 'An animal came for the sweet smell; the lean-to is open and the cloth was only tied with string.',
    remedy: 'protect-from-pests', remedyNotes: 'Skimmed off the top layer the animal could have reached, re-covered, put a weighted crate over the bucket and moved it into the shed with the door shut.',
    summary: 'An animal opened a sweet FFJ bucket overnight. The untouched part was kept under a weighted crate in a closed shed; about a third was lost to the spill and the skimmed layer.',
    outcome: 'partly', stars: 3, recoveryComment: 'Lost about a third; the rest finished fine.', consentToPublish: true,
    messages: [
      { authorKey: 'lars', kind: 'text', body: 'Does it all have to go?', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'Not all of it. Skim off the top layer it could have licked or touched and leave anything that spilled. What is deeper is fine if it smells right.', minutesAfterOpen: 45 },
      { authorKey: 'tobiah', kind: 'text', body: 'Then a weighted crate over the bucket, and somewhere with a door that shuts.', minutesAfterOpen: 47 },
      { authorKey: 'lars', kind: 'text', body: 'No visit last night.', minutesAfterOpen: 1600 },
    ],
  },

  // ---------- LAB ----------
  {
    key: 'c-lab-layers', batchKey: 'b-rowan-lab', growerKey: 'rowan', mentorKey: 'marta', stage: 'LAB',
    symptoms: ['free-liquid', 'clumped', 'colour-yellow-orange', 'smell-sour'],
    title: 'My LAB milk has split into layers',
    description: '100 ml of soured rice-wash water into 1 litre of milk, 4 days ago, in a jar with a paper cover on a shaded kitchen shelf at about 20 °C. There is a thick cream-coloured layer on top and yellowish liquid underneath, and it smells sour like yoghurt. Has it gone off?',
    openedDaysAgo: 44, status: 'recovered',
    cause: 'normal-change', causeNotes: 'This is the separation you wait for: the curds float, and the yellow serum below is the LAB.',
    remedy: 'wait-and-watch', remedyNotes: 'Left it one more day, lifted off the curds, poured the serum into a labelled bottle and stored it in the fridge.',
    summary: 'LAB milk separated into curds and yellow serum with a clean sour smell on day 4. That is the expected result; the serum was harvested on day 5.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Got about 700 ml of serum. Thanks for explaining it!', consentToPublish: true,
    messages: [
      { authorKey: 'rowan', kind: 'text', body: 'First time making this. It looks like it has curdled.', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'It has not gone off, it has worked! The curds on top and the yellow liquid below are exactly what you want. The yellow liquid is your LAB serum.', minutesAfterOpen: 15 },
      { authorKey: 'marta', kind: 'aside', body: 'New grower. Keep it simple and spell out the harvest steps.', minutesAfterOpen: 16 },
      { authorKey: 'marta', kind: 'text', body: 'Leave it one more day. Then lift the curds off with a clean spoon (they can go to the compost) and pour the yellow liquid into a clean bottle with a loose cap. Label it and keep it cold.', minutesAfterOpen: 18 },
      { authorKey: 'rowan', kind: 'text', body: 'Done, about 700 ml. Smells like yoghurt.', minutesAfterOpen: 1500 },
      { authorKey: 'marta', kind: 'text', body: 'Perfect. Use it about 1 part to 1000 parts water.', minutesAfterOpen: 1510 },
    ],
  },
  {
    key: 'c-lab-pink-curds', batchKey: 'b-kofi-lab', growerKey: 'kofi', mentorKey: 'keiko', stage: 'LAB',
    symptoms: ['colour-pink-red', 'smell-putrid'],
    title: 'Pink patches on my LAB curds',
    description: 'Rice-wash starter into 2 litres of raw milk, 6 days ago, in the utility room at about 26 °C. The curds have pink patches and the serum smells rancid and rotten, not sour.',
    openedDaysAgo: 216, status: 'lost',
    cause: 'unwanted-microbes', causeNotes: 'A warm room and a long run gave spoilage bacteria time; the pink colour and rotten smell show they won.',
    remedy: 'discard-restart', remedyNotes: 'Poured away from the beds; jar scrubbed with hot water. Restart from fresh rice-wash water in a cooler spot, checking from day 3.',
    summary: 'LAB milk grew pink patches and smelled rotten after 6 days at 26 °C. Discarded; restarted somewhere cooler, harvesting within 3 to 5 days.',
    outcome: 'lost', stars: 5, recoveryComment: 'The restart in the hall separated cleanly on day 4.', consentToPublish: true,
    messages: [
      { authorKey: 'kofi', kind: 'text', body: 'Is pink ever all right?', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'Not in LAB, I am afraid. Pink and rotten means discard. Good LAB smells clean and sour, like yoghurt.', minutesAfterOpen: 25 },
      { authorKey: 'keiko', kind: 'text', body: 'Pour it away from your beds and scrub the jar with hot water. Next time start from fresh rice water, keep it somewhere cooler than 26, and check from day 3; it is usually done in 3 to 5 days.', minutesAfterOpen: 27 },
      { authorKey: 'kofi', kind: 'text', body: 'Understood. Thanks.', minutesAfterOpen: 100 },
    ],
  },
  {
    key: 'c-lab-cold-shed', batchKey: 'b-ilse-lab', growerKey: 'ilse', mentorKey: 'keiko', stage: 'LAB',
    symptoms: ['smell-none', 'colour-white'],
    title: 'LAB milk not separating after 5 days',
    description: 'Mixed 100 ml of rice-wash starter with 1 litre of milk 5 days ago, in the unheated shed, which is about 9–10 °C at the moment. No separation, no smell; it still looks like milk.',
    openedDaysAgo: 294, status: 'recovered',
    cause: 'too-cold', causeNotes: 'At about 10 °C the bacteria barely got going.',
    remedy: 'move-warmer', remedyNotes: 'Moved the jar indoors to a shaded shelf at about 19 °C. It separated two days later.',
    summary: 'LAB milk in a 10 °C shed did nothing for 5 days. On a shaded indoor shelf at about 19 °C it separated in two days.',
    outcome: 'recovered', stars: 4, recoveryComment: 'Separated two days after I brought it in.', consentToPublish: false,
    messages: [
      { authorKey: 'ilse', kind: 'text', body: 'Did the starter not work?', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'The starter is probably fine; it is too cold for the bacteria to get going. Bring it indoors, somewhere shaded at room temperature, not by the stove.', minutesAfterOpen: 30 },
      { authorKey: 'ilse', kind: 'text', body: 'Split today! Yellow liquid under the curds.', minutesAfterOpen: 2900 },
      { authorKey: 'keiko', kind: 'text', body: 'There you go. Harvest the serum and keep it cold.', minutesAfterOpen: 2920 },
    ],
  },
  {
    key: 'c-lab-stored-fizz', batchKey: 'b-sami-lab', growerKey: 'sami', mentorKey: 'ama', stage: 'LAB',
    symptoms: ['bubbling', 'smell-sour', 'smell-alcoholic'],
    title: 'Stored LAB serum fizzing in the pantry',
    description: '500 g of LAB serum from last month, in a bottle with a loose cap, no sugar, on the pantry shelf at around 20 °C. It fizzes when I tip it and smells sharper and a bit boozy.',
    openedDaysAgo: 100, status: 'recovered',
    cause: 'too-little-sugar', causeNotes: 'Serum kept at room temperature without sugar carried on fermenting.',
    remedy: 'add-sugar', remedyNotes: 'Mixed in 500 g of brown sugar (equal weight) and moved the bottle to the fridge.',
    summary: 'LAB serum stored warm without sugar kept fermenting. An equal weight of brown sugar and a place in the fridge stopped the fizzing.',
    outcome: 'recovered', stars: 4, recoveryComment: 'No more fizz, and it kept for months.', consentToPublish: true,
    messages: [
      { authorKey: 'sami', kind: 'text', body: 'Is it still usable?', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'If it smells sour and clean, yes. Serum keeps best cold, and many of us mix it with the same weight of brown sugar to hold it. Stir in 500 g and put it in the fridge.', minutesAfterOpen: 30 },
      { authorKey: 'sami', kind: 'text', body: 'No fizz this morning.', minutesAfterOpen: 1450 },
    ],
  },

  // ---------- OHN ----------
  {
    key: 'c-ohn-ginger-fuzz', batchKey: 'b-hana-ohn', growerKey: 'hana', mentorKey: 'keiko', stage: 'OHN',
    symptoms: ['fuzzy-growth', 'colour-white', 'colour-light-grey', 'smell-alcoholic'],
    title: 'White fuzz on ginger pieces in my herbal jar',
    description: '500 g of sliced ginger moistened with beer, then 300 g of brown sugar, 4 days ago. Some slices stick up above the liquid and have white-grey fuzz on them. Underneath, it smells of alcohol and ginger.',
    openedDaysAgo: 176, status: 'recovered',
    cause: 'unwanted-microbes', causeNotes: 'Slices above the liquid dried at the edges and caught a surface mould; the liquid below was sound.',
    remedy: 'remove-spoiled', remedyNotes: 'Lifted out the fuzzy slices, pressed the rest under with a clean saucer, and added the spirit a day early to cover everything.',
    summary: 'Ginger slices poking out of an OHN jar grew white-grey fuzz. Removing them and keeping the rest under the liquid kept the batch sound.',
    outcome: 'recovered', stars: 4, recoveryComment: 'No new fuzz, and the extract smells strongly of ginger.', consentToPublish: true,
    messages: [
      { authorKey: 'hana', kind: 'text', body: 'Only the bits sticking out have fuzz.', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'That is the usual place. Mask on, lift out the fuzzy slices with a clean spoon, and keep everything else under the liquid. You can add the spirit a little early to cover it all.', minutesAfterOpen: 35 },
      { authorKey: 'hana', kind: 'text', body: 'What do I weigh them down with?', minutesAfterOpen: 50 },
      { authorKey: 'keiko', kind: 'text', body: 'A clean saucer, or a small jar of water that fits inside.', minutesAfterOpen: 55 },
      { authorKey: 'hana', kind: 'text', body: 'No new fuzz.', minutesAfterOpen: 1500 },
    ],
  },
  {
    key: 'c-ohn-musty-garlic', batchKey: 'b-tomasz-ohn', growerKey: 'tomasz', mentorKey: 'dunstan', stage: 'OHN',
    symptoms: ['smell-musty', 'colour-dark-grey'],
    title: 'Garlic in my herbal nutrient smells musty',
    description: '400 g of crushed garlic, moistened and sugared, then covered with spirit 10 days ago. The jar smells stale and musty rather than sharp and garlicky, and the cloves under the liquid have dark grey patches.',
    openedDaysAgo: 140, status: 'lost',
    cause: 'unwanted-microbes', causeNotes: 'Mould got into the garlic during a long sugar stage, before the spirit went in.',
    remedy: 'remove-spoiled', remedyNotes: 'Removed the grey cloves and topped up the spirit.',
    summary: 'An OHN garlic jar turned musty with dark grey patches under the liquid. Removing the grey cloves did not clear the smell, and the batch was discarded in the end. When the whole jar smells musty, discard rather than pick.',
    outcome: 'lost', stars: 2, recoveryComment: 'Still musty days later. Poured it away.', consentToPublish: true,
    messages: [
      { authorKey: 'tomasz', kind: 'text', body: 'Can I pick out the grey ones?', minutesAfterOpen: 0 },
      { authorKey: 'dunstan', kind: 'text', body: 'Pick out the grey cloves, top up with spirit, and see whether the smell clears.', minutesAfterOpen: 60 },
      { authorKey: 'dunstan', kind: 'aside', body: 'Musty through the whole jar. Not hopeful; let it be tried.', minutesAfterOpen: 62 },
      { authorKey: 'tomasz', kind: 'text', body: 'Still musty a few days later.', minutesAfterOpen: 4300 },
      { authorKey: 'dunstan', kind: 'text', body: 'Then let it go, sorry. Pour it away from the beds and keep it away from flames while you do.', minutesAfterOpen: 4320 },
    ],
  },
  {
    key: 'c-ohn-cloudy', batchKey: 'b-priya-ohn', growerKey: 'priya', mentorKey: 'ama', stage: 'OHN',
    symptoms: ['colour-brown', 'smell-alcoholic', 'clumped'],
    title: 'Cloudy herbal nutrient with sludge at the bottom',
    description: 'Cinnamon bark and liquorice root, 300 g each, sugar stage done, spirit added 3 weeks ago. It is dark brown and cloudy, with a layer of brown sludge and clumped bits at the bottom. Smells strongly of alcohol and cinnamon.',
    openedDaysAgo: 40, status: 'recovered',
    cause: 'normal-change', causeNotes: 'Cloudiness and sediment are what an extract of roots and bark looks like.',
    remedy: 'wait-and-watch', remedyNotes: 'Left it to finish extracting, let it settle for a few days, and poured off the clearer top.',
    summary: 'A dark, cloudy OHN with brown sediment and a strong spirit-and-spice smell. Normal; left to finish, settled and decanted.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Settled nicely; poured off a clear dark extract.', consentToPublish: true,
    messages: [
      { authorKey: 'priya', kind: 'text', body: 'Should it be clear by now?', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'Not necessarily. Cloudy, dark and sludgy with a strong smell is what an extract looks like.', minutesAfterOpen: 40 },
      { authorKey: 'ama', kind: 'text', body: 'Let it finish, then let it stand a few days and pour off the top gently. Keep it away from flames; it is mostly spirit.', minutesAfterOpen: 42 },
      { authorKey: 'priya', kind: 'text', body: 'Thanks, will do.', minutesAfterOpen: 90 },
    ],
  },

  // ---------- WCA ----------
  {
    key: 'c-wca-fizzing', batchKey: 'b-greta-wca', growerKey: 'greta', mentorKey: 'keiko', stage: 'WCA',
    symptoms: ['bubbling', 'smell-sour', 'colour-white'],
    title: 'Eggshell calcium jar bubbling like mad',
    description: '200 g of toasted, crushed eggshells into 2 kg of rice vinegar yesterday. Bubbles are streaming up all the time, the shells bob up and down, and there is some white foam. Smells of vinegar. Is this a fermentation gone wrong?',
    openedDaysAgo: 84, status: 'recovered',
    cause: 'normal-change', causeNotes: 'The bubbles are gas from the vinegar dissolving the shell, not spoilage.',
    remedy: 'wait-and-watch', remedyNotes: 'Left it loosely covered until the bubbling stopped on about day 9, then strained.',
    summary: 'WCA bubbling hard on day one. That is the vinegar dissolving the shells, not spoilage; left loosely covered until the bubbling stopped.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Stopped bubbling on day 9 and strained clear.', consentToPublish: true,
    messages: [
      { authorKey: 'greta', kind: 'text', body: 'It will not stop fizzing.', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'That is chemistry, not a fermentation! The vinegar eats the shell and gives off gas. Bubbling is how you know it is working.', minutesAfterOpen: 20 },
      { authorKey: 'keiko', kind: 'text', body: 'Just make sure the cover is loose, never screwed on. It is done when the bubbles stop.', minutesAfterOpen: 22 },
      { authorKey: 'greta', kind: 'text', body: 'Ha, thank you.', minutesAfterOpen: 60 },
    ],
  },
  {
    key: 'c-wca-popped-lid', batchKey: 'b-mateo-wca', growerKey: 'mateo', mentorKey: 'marta', stage: 'WCA',
    symptoms: ['bubbling', 'free-liquid'],
    title: 'Lid popped off my eggshell vinegar',
    description: 'Put 150 g of toasted shells into 1.5 kg of vinegar and screwed the lid on. Next morning the lid had popped and vinegar had foamed out over the shelf. Still bubbling.',
    openedDaysAgo: 29, status: 'recovered',
    cause: 'poor-air', causeNotes: 'A screwed-down lid trapped the gas the shells give off while they dissolve.',
    remedy: 'change-cover', remedyNotes: 'Wiped up, replaced the lid with paper tied on, and moved it to a taller jar so the foam has room.',
    summary: 'WCA sealed with a lid built gas pressure and foamed over. A paper cover and a taller jar solved it.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Calm since, and it finished clear.', consentToPublish: true,
    messages: [
      { authorKey: 'mateo', kind: 'text', body: 'Vinegar everywhere. Did I ruin it?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'Not ruined, and good thing it popped rather than cracked! The shells give off gas the whole time they dissolve. Never seal it.', minutesAfterOpen: 15 },
      { authorKey: 'marta', kind: 'text', body: 'Paper over the top, tied on, and a taller jar if you have one so the foam has room.', minutesAfterOpen: 17 },
      { authorKey: 'mateo', kind: 'text', body: 'Paper on, taller jar, all calm.', minutesAfterOpen: 1450 },
    ],
  },
  {
    key: 'c-wca-rotten-egg', batchKey: 'b-signe-wca', growerKey: 'signe', mentorKey: 'keiko', stage: 'WCA',
    symptoms: ['smell-putrid', 'slimy', 'colour-light-grey'],
    title: 'Eggshell vinegar smells rotten',
    description: 'I did not toast the shells or take the skins off, just crushed about 250 g and put them in 2.5 kg of vinegar. After 10 days it smells like rotten eggs and there is a grey slimy film on top.',
    openedDaysAgo: 160, status: 'lost',
    cause: 'unwanted-microbes', causeNotes: 'Membranes and egg white left on untoasted shells rotted.',
    remedy: 'discard-restart', remedyNotes: 'Poured away from the beds; jar scrubbed. Restart with membranes peeled off and shells toasted dry and lightly brown.',
    summary: 'WCA from untoasted shells with the membranes left on went putrid with a slimy film. Discarded; the restart with cleaned, toasted shells smelled clean throughout.',
    outcome: 'lost', stars: 4, recoveryComment: 'The second jar with toasted shells was fine.', consentToPublish: true,
    messages: [
      { authorKey: 'signe', kind: 'text', body: 'I skipped the toasting to save time.', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'That will be it. The thin skin inside the shell rots if it is left on. With a rotten smell and slime, this one goes; it will not clear.', minutesAfterOpen: 25 },
      { authorKey: 'keiko', kind: 'aside', body: 'Make the restart steps very concrete.', minutesAfterOpen: 26 },
      { authorKey: 'keiko', kind: 'text', body: 'For the next jar: peel or rub the skin off, dry the shells, toast them in a pan until lightly brown, crush, then vinegar. Loose cover.', minutesAfterOpen: 28 },
      { authorKey: 'signe', kind: 'text', body: 'Poured it out. Toasting the next lot now.', minutesAfterOpen: 200 },
    ],
  },

  // ---------- WCS ----------
  {
    key: 'c-wcs-meat-left', batchKey: 'b-ollie-wcs', growerKey: 'ollie', mentorKey: 'tobiah', stage: 'WCS',
    symptoms: ['smell-putrid', 'colour-dark-grey', 'insects'],
    title: 'Bone vinegar smells like rotting meat, flies everywhere',
    description: 'Charred some chicken and pork bones on the fire pit, but a few still had bits of meat on. 500 g into 5 kg of vinegar a week ago. It stinks of rotting meat, there is a dark grey scum, and there are flies and some maggots round the rim.',
    openedDaysAgo: 192, status: 'lost',
    cause: 'unwanted-microbes', causeNotes: 'Meat and fat left on under-charred bones rotted.',
    remedy: 'discard-restart', remedyNotes: 'Bagged tightly and put out with household waste as local rules allow. Restart with bones boiled clean and charred until they snap.',
    summary: 'WCS with meat left on the bones went putrid, with flies and maggots. Discarded; the restart with fully cleaned, well-charred bones stayed clean.',
    outcome: 'lost', stars: 5, recoveryComment: 'The second jar smells of vinegar and smoke, nothing else.', consentToPublish: true,
    messages: [
      { authorKey: 'ollie', kind: 'text', body: 'It is really bad.', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'That one is gone, I am afraid. Rotting meat and maggots cannot be fixed, and you do not want it anywhere near food.', minutesAfterOpen: 20 },
      { authorKey: 'tobiah', kind: 'text', body: 'Gloves on, bag it tight, and put it out with the rubbish as your local rules say. Next time boil the bones clean first and char them until they snap.', minutesAfterOpen: 22 },
      { authorKey: 'ollie', kind: 'text', body: 'Bagged it.', minutesAfterOpen: 100 },
    ],
  },
  {
    key: 'c-wcs-black-char', batchKey: 'b-della-wcs', growerKey: 'della', mentorKey: 'keiko', stage: 'WCS',
    symptoms: ['colour-black', 'bubbling', 'smell-sour'],
    title: 'Black bits in my bone calcium jar',
    description: 'Charred beef bones until black and brittle, 300 g into 3 kg of vinegar, yesterday. The liquid has gone dark, black bits are floating, and it is fizzing. The signs guide says black means discard?',
    openedDaysAgo: 24, status: 'recovered',
    cause: 'normal-change', causeNotes: 'The black is char from the bones, not growth. Clean vinegar smell, no slime.',
    remedy: 'wait-and-watch', remedyNotes: 'Left it loosely covered to finish; judged by smell and texture rather than colour.',
    summary: 'WCS liquid darkened with black char and fizzed on day one. Char is not black mould: with a clean vinegar smell and no slime, it was left to finish.',
    outcome: 'recovered', stars: 5, recoveryComment: 'Finished bubbling after about two weeks, clean smell all the way.', consentToPublish: true,
    messages: [
      { authorKey: 'della', kind: 'text', body: 'Photos attached. Discard or not?', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'Good question! The black rule is about black growth. Your bones are black because you charred them, and bits of char float off. That is fine.', minutesAfterOpen: 20 },
      { authorKey: 'keiko', kind: 'text', body: 'Judge it by smell and texture: clean vinegar, no slime, no fuzzy layer growing on top. The fizzing is the vinegar dissolving the bone.', minutesAfterOpen: 22 },
      { authorKey: 'della', kind: 'text', body: 'Smells like vinegar and a bit smoky.', minutesAfterOpen: 40 },
      { authorKey: 'keiko', kind: 'text', body: 'Then it is right. Leave it, loosely covered.', minutesAfterOpen: 45 },
    ],
  },

  // ---------- other ----------
  {
    key: 'c-other-fish-flies', growerKey: 'yusuf', mentorKey: 'marta', stage: 'other', location: 'the south allotments',
    symptoms: ['insects', 'free-liquid', 'smell-sweet'],
    title: 'Flies laying on the cover of my fish ferment',
    description: 'Fish scraps (about 1 kg) with 1 kg of brown sugar in a bucket, 2 weeks old. Liquid has come up nicely and it smells sweet and fishy, but the cloth cover is loose and flies are sitting on it; there are a few eggs on the rim. Nothing in the liquid that I can see.',
    openedDaysAgo: 20, status: 'recovered',
    cause: 'pests', causeNotes: 'A loose cloth cover let flies reach the rim.',
    remedy: 'protect-from-pests', remedyNotes: 'Wiped the rim clean, replaced the cloth with a tight double layer tied under the rim, and set the bucket inside a larger bin with its lid propped for air.',
    summary: 'Flies laid eggs on the rim of a fish-and-sugar ferment under a loose cover. Cleaned and covered tightly before anything reached the liquid, it finished well. Maggots in the liquid would have meant discarding it.',
    outcome: 'recovered', stars: 4, recoveryComment: 'No flies after the new cover. Finished fine.', consentToPublish: true,
    messages: [
      { authorKey: 'yusuf', kind: 'text', body: 'Is it safe to keep going?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'If nothing has reached the liquid, yes. Gloves on, wipe the rim and bag the old cloth. Then a tight double cloth tied under the rim.', minutesAfterOpen: 30 },
      { authorKey: 'marta', kind: 'text', body: 'If you ever see maggots in the liquid itself, that is the end of it: bag it and start again.', minutesAfterOpen: 32 },
      { authorKey: 'marta', kind: 'aside', body: 'Fish ferments are outside our stage list; keep an eye on this one.', minutesAfterOpen: 33 },
      { authorKey: 'yusuf', kind: 'text', body: 'Cleaned and covered. Bucket is inside a bigger bin now.', minutesAfterOpen: 180 },
    ],
  },

  // ---------- watching: closed, waiting for the recovery report ----------
  {
    key: 'c-imo4-overwatered', batchKey: 'b-clementine-imo4', growerKey: 'clementine', mentorKey: 'tobiah', stage: 'IMO4',
    symptoms: ['wet-sloppy', 'smell-sour'],
    title: 'IMO4 heap sloppy after watering',
    description: 'IMO3 and soil, half and half, about 16 kg, a week old. I watered it yesterday because the top looked dry and overdid it. Now it is wet and sloppy and smells sour.',
    openedDaysAgo: 2.5, status: 'watching',
    cause: 'too-wet', causeNotes: 'Too much water in one go on a heap that was only dry on top.',
    remedy: 'add-dry-matter', remedyNotes: 'Mix in dry soil from the same beds a few shovels at a time until the squeeze test is right; cover and do not water for a few days.',
    summary: 'Over-watered IMO4 went sloppy and sour. Dry soil mixed in to the squeeze-test point; watching for the sour smell to clear.',
    consentToPublish: true,
    messages: [
      { authorKey: 'clementine', kind: 'text', body: 'I think I drowned it.', minutesAfterOpen: 0 },
      { authorKey: 'tobiah', kind: 'text', body: 'Mix in dry soil from the same beds, a few shovels at a time, until it passes the squeeze test again. Then cover it and leave the watering can alone for a few days.', minutesAfterOpen: 30 },
      { authorKey: 'clementine', kind: 'text', body: 'Done, it feels right now. Still a little sour.', minutesAfterOpen: 200 },
      { authorKey: 'tobiah', kind: 'text', body: 'Good. Turn it tomorrow and tell us how it smells in a few days.', minutesAfterOpen: 215 },
    ],
  },

  // ---------- open: on the rounds now ----------
  {
    key: 'c-open-rowan-imo2', batchKey: 'b-rowan-imo2', growerKey: 'rowan', stage: 'IMO2',
    symptoms: ['bubbling', 'smell-alcoholic', 'free-liquid'],
    title: 'IMO2 jar has started bubbling',
    description: 'Mixed 1.2 kg of my IMO1 culture with 700 g of brown sugar 9 days ago (I did not have more). Glass jar with a paper cover on the kitchen shelf, about 19 °C. Since yesterday small bubbles come up along the glass and it smells yeasty. No odd colours.',
    openedDaysAgo: 0.12, status: 'awaiting_mentor',
    messages: [
      { authorKey: 'rowan', kind: 'text', body: 'Photos attached. I can get more sugar tomorrow if that is what it needs.', minutesAfterOpen: 0 },
      { authorKey: 'rowan', kind: 'text', body: 'Forgot to say: there is a little syrup at the bottom too.', minutesAfterOpen: 40 },
    ],
  },
  {
    key: 'c-open-rowan-fpj', batchKey: 'b-rowan-fpj', growerKey: 'rowan', mentorKey: 'marta', stage: 'FPJ',
    symptoms: ['bubbling', 'smell-sour', 'free-liquid'],
    title: 'FPJ warm and very frothy on day 4',
    description: '800 g of young nettle tips with 800 g of brown sugar, packed in a crock on the porch. Day 4. Thick froth on top, lots of liquid, and it smells sour-sweet. The porch gets the afternoon sun and the crock feels warm to the touch.',
    openedDaysAgo: 0.6, status: 'in_conversation',
    messages: [
      { authorKey: 'rowan', kind: 'text', body: 'Is this much froth normal for plant juice?', minutesAfterOpen: 0 },
      { authorKey: 'marta', kind: 'text', body: 'Some froth is normal early on. Your sugar is right at equal weights, so I would look at the warmth first. Can you move it somewhere shaded and cool today?', minutesAfterOpen: 35 },
      { authorKey: 'marta', kind: 'aside', body: 'Same grower as the LAB case last month. Sugar is fine here; it is the sun.', minutesAfterOpen: 36 },
      { authorKey: 'rowan', kind: 'text', body: 'Moved it to the floor of the hall cupboard. Should I skim the froth?', minutesAfterOpen: 80 },
      { authorKey: 'marta', kind: 'text', body: 'Yes, skim it gently with a clean spoon. Look again in a few hours and tell me how it smells.', minutesAfterOpen: 95 },
      { authorKey: 'rowan', kind: 'text', body: 'Looked again just now: the froth is lower and it smells more sweet than sour.', minutesAfterOpen: 600 },
    ],
  },
  {
    key: 'c-open-lucia-imo3', batchKey: 'b-lucia-imo3', growerKey: 'lucia', stage: 'IMO3',
    symptoms: ['smell-ammonia', 'wet-sloppy', 'colour-white'],
    title: 'Bran pile hot and smelling of ammonia',
    description: '15 kg of wheat bran with diluted IMO2, 6 days old, under straw on the barn floor. The core read 51 °C this morning and there is an ammonia smell. A squeezed handful just about drips. White growth on the outside.',
    openedDaysAgo: 0.3, status: 'awaiting_mentor',
    messages: [
      { authorKey: 'lucia', kind: 'text', body: 'Should I turn it now or wait for advice?', minutesAfterOpen: 0 },
      { authorKey: 'lucia', kind: 'text', body: 'Turned it once anyway. Still 49 °C an hour later.', minutesAfterOpen: 120 },
    ],
  },
  {
    key: 'c-open-nia-lab', batchKey: 'b-nia-lab', growerKey: 'nia', mentorKey: 'keiko', stage: 'LAB',
    symptoms: ['colour-yellow-orange', 'smell-sour', 'free-liquid'],
    title: 'LAB serum looks a bit pinkish?',
    description: '150 ml of rice-wash starter into 1.5 litres of milk, day 5 when I noticed. It separated well, but the serum looks orange-pink under the kitchen light. The smell is sour like yoghurt, maybe a bit sharp.',
    openedDaysAgo: 1.2, status: 'over_to_grower',
    messages: [
      { authorKey: 'nia', kind: 'text', body: 'Photo attached, taken in the evening.', minutesAfterOpen: 0 },
      { authorKey: 'keiko', kind: 'text', body: 'Yellow-orange serum is normal; pink is not. Kitchen light can fool you. Could you take a photo by a window in daylight, next to something white?', minutesAfterOpen: 60 },
      { authorKey: 'keiko', kind: 'aside', body: 'If it is truly pink: discard. The smell sounds fine, so probably yellow.', minutesAfterOpen: 61 },
      { authorKey: 'keiko', kind: 'text', body: 'And give it a careful sniff: clean sour is good, rotten or rancid is not.', minutesAfterOpen: 63 },
    ],
  },
  {
    key: 'c-open-juniper-ffj', growerKey: 'juniper', stage: 'FFJ', location: 'shed on Tansy row',
    symptoms: ['fuzzy-growth', 'colour-blue-green', 'smell-sweet'],
    title: 'Grey-green fuzz on the fruit in my FFJ',
    description: '2 kg of ripe peaches and 2 kg of brown sugar, 6 days old, in a jar in the shed. The peach pieces floating at the top have grey-green fuzzy spots. The liquid smells sweet and fruity.',
    openedDaysAgo: 0.9, status: 'awaiting_mentor',
    messages: [
      { authorKey: 'juniper', kind: 'text', body: 'Only on the pieces above the liquid. Photo attached.', minutesAfterOpen: 0 },
      { authorKey: 'juniper', kind: 'text', body: 'The spots are a little bigger than when I first looked.', minutesAfterOpen: 600 },
    ],
  },
  {
    key: 'c-open-femi-wca', batchKey: 'b-femi-wca', growerKey: 'femi', mentorKey: 'ama', stage: 'WCA',
    symptoms: ['smell-sour', 'clumped'],
    title: 'Eggshell calcium hardly bubbling',
    description: 'Toasted 180 g of shells and put them in 1.8 kg of clear shop vinegar 2 days ago. Hardly any bubbles at all; the shells sit clumped at the bottom. Smells of vinegar.',
    openedDaysAgo: 0.4, status: 'in_conversation',
    messages: [
      { authorKey: 'femi', kind: 'text', body: 'Everyone says it should fizz. Mine barely does.', minutesAfterOpen: 0 },
      { authorKey: 'ama', kind: 'text', body: 'Clear shop vinegar is often weaker than a brewed rice or fruit vinegar. Try a test: a few shell pieces in a cup of fresh vinegar. Do they fizz?', minutesAfterOpen: 45 },
      { authorKey: 'femi', kind: 'text', body: 'They fizz a little in the cup, more than in the jar. The ones in the jar are all stuck together.', minutesAfterOpen: 90 },
    ],
  },
];
