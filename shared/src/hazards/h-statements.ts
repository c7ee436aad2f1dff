/**
 * Hazard (H) statement texts of the UN GHS, and the precautionary (P) statement codes that
 * follow directly from the classes this module classifies.
 *
 * Source: UN GHS (ST/SG/AC.10/30), Rev. 9 (2021) / Rev. 10 (2023), Annex 3, section 1 (hazard
 * statements) and sections 2–3 (precautionary statements and their assignment by class and
 * category). The texts and code lists below were written FROM MEMORY and not checked against
 * the printed annex; the label a product carries must be taken from the current GHS / CLP text
 * (CLP Annex III and Annex IV for the EU) and the suppliers' safety data sheets.
 */

export const H_STATEMENTS_SOURCE = 'UN GHS Rev. 9/10, Annex 3 section 1 (texts written from memory, not verified against the printed annex)';
export const P_STATEMENTS_SOURCE = 'UN GHS Rev. 9/10, Annex 3 sections 2–3 / CLP Annex IV (code assignment by class written from memory)';

/**
 * H-statement texts by code (UN GHS Annex 3, section 1; from memory). Physical hazards H200–H290,
 * health hazards H300–H373, environmental hazards H400–H420. `<…>` marks where the label names
 * the organs or the route.
 *
 * @example H_STATEMENTS.H272 // → 'May intensify fire; oxidizer'
 */
export const H_STATEMENTS: Readonly<Record<string, string>> = {
  // Physical hazards
  H200: 'Unstable explosive',
  H201: 'Explosive; mass explosion hazard',
  H202: 'Explosive; severe projection hazard',
  H203: 'Explosive; fire, blast or projection hazard',
  H204: 'Fire or projection hazard',
  H205: 'May mass explode in fire',
  H206: 'Fire, blast or projection hazard; increased risk of explosion if desensitizing agent is reduced',
  H207: 'Fire or projection hazard; increased risk of explosion if desensitizing agent is reduced',
  H208: 'Fire hazard; increased risk of explosion if desensitizing agent is reduced',
  H220: 'Extremely flammable gas',
  H221: 'Flammable gas',
  H222: 'Extremely flammable aerosol',
  H223: 'Flammable aerosol',
  H224: 'Extremely flammable liquid and vapour',
  H225: 'Highly flammable liquid and vapour',
  H226: 'Flammable liquid and vapour',
  H227: 'Combustible liquid',
  H228: 'Flammable solid',
  H229: 'Pressurized container: may burst if heated',
  H230: 'May react explosively even in the absence of air',
  H231: 'May react explosively even in the absence of air at elevated pressure and/or temperature',
  H232: 'May ignite spontaneously if exposed to air',
  H240: 'Heating may cause an explosion',
  H241: 'Heating may cause a fire or explosion',
  H242: 'Heating may cause a fire',
  H250: 'Catches fire spontaneously if exposed to air',
  H251: 'Self-heating; may catch fire',
  H252: 'Self-heating in large quantities; may catch fire',
  H260: 'In contact with water releases flammable gases which may ignite spontaneously',
  H261: 'In contact with water releases flammable gas',
  H270: 'May cause or intensify fire; oxidizer',
  H271: 'May cause fire or explosion; strong oxidizer',
  H272: 'May intensify fire; oxidizer',
  H280: 'Contains gas under pressure; may explode if heated',
  H281: 'Contains refrigerated gas; may cause cryogenic burns or injury',
  H282: 'Extremely flammable chemical under pressure: may explode if heated',
  H283: 'Flammable chemical under pressure: may explode if heated',
  H284: 'Chemical under pressure: may explode if heated',
  H290: 'May be corrosive to metals',
  // Health hazards
  H300: 'Fatal if swallowed',
  H301: 'Toxic if swallowed',
  H302: 'Harmful if swallowed',
  H303: 'May be harmful if swallowed',
  H304: 'May be fatal if swallowed and enters airways',
  H305: 'May be harmful if swallowed and enters airways',
  H310: 'Fatal in contact with skin',
  H311: 'Toxic in contact with skin',
  H312: 'Harmful in contact with skin',
  H313: 'May be harmful in contact with skin',
  H314: 'Causes severe skin burns and eye damage',
  H315: 'Causes skin irritation',
  H316: 'Causes mild skin irritation',
  H317: 'May cause an allergic skin reaction',
  H318: 'Causes serious eye damage',
  H319: 'Causes serious eye irritation',
  H320: 'Causes eye irritation',
  H330: 'Fatal if inhaled',
  H331: 'Toxic if inhaled',
  H332: 'Harmful if inhaled',
  H333: 'May be harmful if inhaled',
  H334: 'May cause allergy or asthma symptoms or breathing difficulties if inhaled',
  H335: 'May cause respiratory irritation',
  H336: 'May cause drowsiness or dizziness',
  H340: 'May cause genetic defects <route of exposure>',
  H341: 'Suspected of causing genetic defects <route of exposure>',
  H350: 'May cause cancer <route of exposure>',
  H351: 'Suspected of causing cancer <route of exposure>',
  H360: 'May damage fertility or the unborn child <effect, route of exposure>',
  H361: 'Suspected of damaging fertility or the unborn child <effect, route of exposure>',
  H362: 'May cause harm to breast-fed children',
  H370: 'Causes damage to organs <organs, route of exposure>',
  H371: 'May cause damage to organs <organs, route of exposure>',
  H372: 'Causes damage to organs <organs> through prolonged or repeated exposure <route of exposure>',
  H373: 'May cause damage to organs <organs> through prolonged or repeated exposure <route of exposure>',
  // Environmental hazards
  H400: 'Very toxic to aquatic life',
  H401: 'Toxic to aquatic life',
  H402: 'Harmful to aquatic life',
  H410: 'Very toxic to aquatic life with long lasting effects',
  H411: 'Toxic to aquatic life with long lasting effects',
  H412: 'Harmful to aquatic life with long lasting effects',
  H413: 'May cause long lasting harmful effects to aquatic life',
  H420: 'Harms public health and the environment by destroying ozone in the upper atmosphere',
};

/**
 * The text of an H-statement code.
 *
 * @throws Error when the code is not in {@link H_STATEMENTS} (says which code was found).
 * @example hStatementText('H319') // → 'Causes serious eye irritation'
 */
export function hStatementText(code: string): string {
  const t = H_STATEMENTS[code];
  if (t === undefined) throw new Error(`expected a UN GHS H-statement code such as H302; found ${JSON.stringify(code)}`);
  return t;
}

/** The number of an H- or P-statement code, for ordering: `P301+P330+P331` → 301. */
function codeNumber(code: string): number {
  const m = /(\d{3})/.exec(code);
  return m ? Number(m[1]) : Number.POSITIVE_INFINITY;
}

/**
 * Codes de-duplicated and in numerical order (combined P-statements by their first code, then
 * as written). GHS/CLP print statements grouped by type; numerical order is the usual layout.
 *
 * @example orderStatementCodes(['H319', 'H302', 'H319']) // → ['H302', 'H319']
 */
export function orderStatementCodes(codes: readonly string[]): string[] {
  return [...new Set(codes)].sort((a, b) => codeNumber(a) - codeNumber(b) || (a < b ? -1 : a > b ? 1 : 0));
}

/**
 * P-statement codes that follow directly from a class and category (UN GHS Annex 3 section 3
 * tables / CLP Annex IV; from memory). Keyed `hazardClass:category`. Conditional statements
 * (those the annex attaches "if…" conditions to, e.g. P321 "specific treatment") are included
 * as the annex lists them; the label writer still selects per CLP Art. 28 (usually ≤ 6).
 *
 * @example P_STATEMENTS_BY_CLASS['eye-irrit:2'] // → ['P264', 'P280', 'P305+P351+P338', 'P337+P313']
 */
export const P_STATEMENTS_BY_CLASS: Readonly<Record<string, readonly string[]>> = (() => {
  const oralHigh = ['P264', 'P270', 'P301+P310', 'P321', 'P330', 'P405', 'P501'];
  const dermalHigh = ['P262', 'P264', 'P270', 'P280', 'P302+P352', 'P310', 'P321', 'P361+P364', 'P405', 'P501'];
  const inhalHigh = ['P260', 'P271', 'P284', 'P304+P340', 'P310', 'P320', 'P403+P233', 'P405', 'P501'];
  const skinCorr = ['P260', 'P264', 'P280', 'P301+P330+P331', 'P303+P361+P353', 'P363', 'P304+P340', 'P310', 'P321', 'P305+P351+P338', 'P405', 'P501'];
  const eyeIrrit = ['P264', 'P280', 'P305+P351+P338', 'P337+P313'];
  const oxHigh = ['P210', 'P220', 'P280', 'P283', 'P306+P360', 'P371+P380+P375', 'P370+P378', 'P501'];
  const ox = ['P210', 'P220', 'P280', 'P370+P378', 'P501'];
  const waterReact = ['P223', 'P231+P232', 'P280', 'P302+P335+P334', 'P370+P378', 'P402+P404', 'P501'];
  const flamSol = ['P210', 'P240', 'P241', 'P280', 'P370+P378'];
  return {
    'acute-tox-oral:1': oralHigh,
    'acute-tox-oral:2': oralHigh,
    'acute-tox-oral:3': oralHigh,
    'acute-tox-oral:4': ['P264', 'P270', 'P301+P312', 'P330', 'P501'],
    'acute-tox-oral:5': ['P301+P312'],
    'acute-tox-dermal:1': dermalHigh,
    'acute-tox-dermal:2': dermalHigh,
    'acute-tox-dermal:3': ['P280', 'P302+P352', 'P312', 'P321', 'P361+P364', 'P405', 'P501'],
    'acute-tox-dermal:4': ['P280', 'P302+P352', 'P312', 'P321', 'P362+P364', 'P501'],
    'acute-tox-inhal:1': inhalHigh,
    'acute-tox-inhal:2': inhalHigh,
    'acute-tox-inhal:3': ['P261', 'P271', 'P304+P340', 'P311', 'P321', 'P403+P233', 'P405', 'P501'],
    'acute-tox-inhal:4': ['P261', 'P271', 'P304+P340', 'P312'],
    'skin-corr:1': skinCorr,
    'skin-corr:1A': skinCorr,
    'skin-corr:1B': skinCorr,
    'skin-corr:1C': skinCorr,
    'skin-irrit:2': ['P264', 'P280', 'P302+P352', 'P321', 'P332+P313', 'P362+P364'],
    'eye-dam:1': ['P280', 'P305+P351+P338', 'P310'],
    'eye-irrit:2': eyeIrrit,
    'eye-irrit:2A': eyeIrrit,
    'eye-irrit:2B': ['P264', 'P305+P351+P338', 'P337+P313'],
    'stot-se:3': ['P261', 'P271', 'P304+P340', 'P312', 'P403+P233', 'P405', 'P501'],
    'ox-sol:1': oxHigh,
    'ox-sol:2': ox,
    'ox-sol:3': ox,
    'water-react:1': waterReact,
    'water-react:2': waterReact,
    'water-react:3': ['P231+P232', 'P280', 'P370+P378', 'P402+P404', 'P501'],
    'flam-sol:1': flamSol,
    'flam-sol:2': flamSol,
    'pyr-sol:1': ['P210', 'P222', 'P231+P232', 'P233', 'P280', 'P302+P335+P334', 'P370+P378'],
    'self-heat:1': ['P235', 'P280', 'P407', 'P413', 'P420'],
    'self-heat:2': ['P235', 'P280', 'P407', 'P413', 'P420'],
    'met-corr:1': ['P234', 'P390', 'P406'],
    'aquatic-acute:1': ['P273', 'P391', 'P501'],
    'aquatic-chronic:1': ['P273', 'P391', 'P501'],
    'aquatic-chronic:2': ['P273', 'P391', 'P501'],
  };
})();

/**
 * "Keep out of reach of children": the general precautionary statement for products supplied
 * to the general public (CLP Annex IV Part 1, P102; UN GHS Annex 3 general statements; from memory).
 */
export const P_KEEP_OUT_OF_REACH_OF_CHILDREN = 'P102';

/**
 * The P-statement codes that follow from a list of classifications, de-duplicated and ordered;
 * classes without an entry in {@link P_STATEMENTS_BY_CLASS} add none.
 *
 * @example pStatementsFor([{ hazardClass: 'eye-irrit', category: '2' }, { hazardClass: 'acute-tox-oral', category: '4' }])
 * // → ['P264', 'P270', 'P280', 'P301+P312', 'P305+P351+P338', 'P330', 'P337+P313', 'P501']
 */
export function pStatementsFor(classes: readonly { hazardClass: string; category: string }[]): string[] {
  return orderStatementCodes(classes.flatMap((c) => P_STATEMENTS_BY_CLASS[`${c.hazardClass}:${c.category}`] ?? []));
}
