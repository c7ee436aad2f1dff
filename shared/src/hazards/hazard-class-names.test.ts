import { describe, expect, it } from 'vitest';
import { hazardClassLabel, hazardKeyLabel } from './hazard-class-names';

// Expected codes: Regulation (EC) No 1272/2008 (CLP), Annex VI Part 1, Table 1.1 "Hazard class and
// category codes" (e.g. "Ox. Sol. 3", "Acute Tox. 4", "Skin Corr. 1B", "STOT SE 3"), and the
// the route of acute toxicity in words after it, as the H-statement (H302 oral, H312 dermal) gives it.
describe('hazard classes in the notation of CLP Annex VI Table 1.1', () => {
  it.each([
    ['ox-sol', '3', 'Ox. Sol. 3'],
    ['acute-tox-oral', '4', 'Acute Tox. 4 (oral)'],
    ['eye-dam', '1', 'Eye Dam. 1'],
    ['eye-irrit', '2', 'Eye Irrit. 2'],
    ['skin-irrit', '2', 'Skin Irrit. 2'],
    ['skin-corr', '1b', 'Skin Corr. 1B'],
    ['stot-se', '3', 'STOT SE 3'],
    ['flam-sol', '1', 'Flam. Sol. 1'],
    ['water-react', '2', 'Water-react. 2'],
    ['met-corr', '1', 'Met. Corr. 1'],
    ['carc', '1a', 'Carc. 1A'],
  ])('%s %s reads "%s"', (cls, cat, expected) => {
    expect(hazardClassLabel(cls, cat)).toBe(expected);
  });

  it.each([
    ['ox-sol-3', 'Ox. Sol. 3'],
    ['acute-tox-4-oral', 'Acute Tox. 4 (oral)'],
    ['acute-tox-oral-4', 'Acute Tox. 4 (oral)'],
    ['eye-irrit-2', 'Eye Irrit. 2'],
    ['ox-sol', 'Ox. Sol.'],
    ['cap:eye-dam-1', 'below Eye Dam. 1'],
    ['un-1942', 'UN 1942'],
  ])('key %s reads "%s"', (key, expected) => {
    expect(hazardKeyLabel(key)).toBe(expected);
  });

  it('keeps unknown keys as written, so nothing is hidden', () => {
    expect(hazardKeyLabel('oxidiser')).toBe('oxidiser');
    expect(hazardClassLabel('made-up', '2')).toBe('made-up 2');
  });
});
