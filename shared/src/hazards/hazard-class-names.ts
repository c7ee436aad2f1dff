/**
 * Hazard classes in the regulation's own notation. The product keys classes in lower case
 * (`ox-sol`, `acute-tox-oral`) and tags them with their category (`ox-sol-3`,
 * `acute-tox-4-oral`, `skin-corr-1b`); a person reads the hazard class and category codes of
 * Regulation (EC) No 1272/2008 (CLP) Annex VI Table 1.1 ("Ox. Sol. 3", "Acute Tox. 4",
 * "Eye Dam. 1", "Skin Irrit. 2", "STOT SE 3"), which follow the GHS classes.
 */

/** Class key → CLP hazard class code (Annex VI, Table 1.1). */
export const CLP_CLASS_CODES: Readonly<Record<string, string>> = {
  'unst-expl': 'Unst. Expl.',
  expl: 'Expl.',
  'flam-gas': 'Flam. Gas',
  aerosol: 'Aerosol',
  'ox-gas': 'Ox. Gas',
  'press-gas': 'Press. Gas',
  'flam-liq': 'Flam. Liq.',
  'flam-sol': 'Flam. Sol.',
  'self-react': 'Self-react.',
  'pyr-liq': 'Pyr. Liq.',
  'pyr-sol': 'Pyr. Sol.',
  'self-heat': 'Self-heat.',
  'water-react': 'Water-react.',
  'ox-liq': 'Ox. Liq.',
  'ox-sol': 'Ox. Sol.',
  'org-perox': 'Org. Perox.',
  'met-corr': 'Met. Corr.',
  'acute-tox': 'Acute Tox.',
  'acute-tox-oral': 'Acute Tox.',
  'acute-tox-dermal': 'Acute Tox.',
  'acute-tox-inhal': 'Acute Tox.',
  'skin-corr': 'Skin Corr.',
  'skin-irrit': 'Skin Irrit.',
  'eye-dam': 'Eye Dam.',
  'eye-irrit': 'Eye Irrit.',
  'resp-sens': 'Resp. Sens.',
  'skin-sens': 'Skin Sens.',
  muta: 'Muta.',
  carc: 'Carc.',
  repr: 'Repr.',
  lact: 'Lact.',
  'stot-se': 'STOT SE',
  'stot-re': 'STOT RE',
  'asp-tox': 'Asp. Tox.',
  'aquatic-acute': 'Aquatic Acute',
  'aquatic-chronic': 'Aquatic Chronic',
  ozone: 'Ozone',
};

const ROUTE_WORDS: Readonly<Record<string, string>> = { oral: 'oral', dermal: 'dermal', inhal: 'inhalation' };

/** Category as printed: sub-categories in capitals (`1b` → `1B`). */
function categoryCode(category: string): string {
  return category.trim().toUpperCase();
}

/**
 * The CLP code of a class and category, e.g. `('ox-sol', '3')` → "Ox. Sol. 3",
 * `('acute-tox-oral', '4')` → "Acute Tox. 4 (oral)", `('skin-corr', '1b')` → "Skin Corr. 1B".
 * An unknown class is returned as written, so nothing is hidden.
 */
export function hazardClassLabel(hazardClass: string, category?: string | null): string {
  const key = hazardClass.trim().toLowerCase();
  const code = CLP_CLASS_CODES[key];
  if (!code) return category ? `${hazardClass} ${category}` : hazardClass;
  const route = /^acute-tox-(oral|dermal|inhal)$/.exec(key)?.[1];
  const cat = category ? ` ${categoryCode(category)}` : '';
  return `${code}${cat}${route ? ` (${ROUTE_WORDS[route]})` : ''}`;
}

/** Class keys, longest first, so `acute-tox-oral` wins over `acute-tox`. */
const KEYS_LONGEST_FIRST = Object.keys(CLP_CLASS_CODES).sort((a, b) => b.length - a.length);

/**
 * A hazard key as a person reads it: a class key (`ox-sol`), a class-category tag (`ox-sol-3`,
 * `acute-tox-4-oral`, `acute-tox-oral-4`, `skin-corr-1b`), a cap token (`cap:eye-dam-1`), the
 * precursor cap (`precursor-an`), a regulatory flag (`eu-2019-1148-an`), a UN number (`un-1942`)
 * or an incompatibility group (`oxidiser`). Unknown keys are returned unchanged.
 *
 * @example hazardKeyLabel('ox-sol-3') // → 'Ox. Sol. 3'
 * @example hazardKeyLabel('cap:eye-dam-1') // → 'below Eye Dam. 1'
 */
export function hazardKeyLabel(key: string): string {
  const k = key.trim().toLowerCase();
  if (k.startsWith('cap:')) {
    const inner = k.slice(4);
    return inner === 'precursor-an' ? hazardKeyLabel(inner) : `below ${hazardKeyLabel(inner)}`;
  }
  if (k === 'precursor-an') return 'below the explosives-precursor limit for ammonium nitrate (Reg. (EU) 2019/1148)';
  if (k === 'eu-2019-1148-an') return 'explosives precursor: ammonium nitrate (Reg. (EU) 2019/1148 Annex I)';
  if (k === 'eu-2019-1148-annex-ii') return 'reportable explosives precursor (Reg. (EU) 2019/1148 Annex II)';
  const un = /^un-(\d{4})$/.exec(k);
  if (un) return `UN ${un[1]}`;
  for (const cls of KEYS_LONGEST_FIRST) {
    if (k === cls) return hazardClassLabel(cls);
    if (!k.startsWith(`${cls}-`)) continue;
    const rest = k.slice(cls.length + 1);
    // `acute-tox-4-oral`: category, then route.
    const catRoute = /^(\d[a-c]?)-(oral|dermal|inhal)$/.exec(rest);
    if (cls === 'acute-tox' && catRoute) return hazardClassLabel(`acute-tox-${catRoute[2]}`, catRoute[1]);
    if (/^\d[a-c]?$|^[a-g]$/.test(rest)) return hazardClassLabel(cls, rest);
  }
  return key;
}
