import { EnergyInputs, euEnergy, usCalories } from './energy';

const none: EnergyInputs = {
  fat: 0,
  salatrims: 0,
  carbohydrate: 0,
  polyols: 0,
  erythritol: 0,
  fibre: 0,
  protein: 0,
  alcohol: 0,
  organicAcids: 0,
};

describe('EU energy, Reg (EU) 1169/2011 Annex XIV conversion factors', () => {
  it.each([
    // Regulation (EU) No 1169/2011 Annex XIV: carbohydrate (except polyols) and protein 17 kJ / 4 kcal
    // per g, fat 37 kJ / 9 kcal, fibre 8 kJ / 2 kcal.
    { what: 'carbohydrate 10 g', n: { carbohydrate: 10 }, kj: 170, kcal: 40 },
    { what: 'protein 10 g', n: { protein: 10 }, kj: 170, kcal: 40 },
    { what: 'fat 10 g', n: { fat: 10 }, kj: 370, kcal: 90 },
    { what: 'fibre 10 g', n: { fibre: 10 }, kj: 80, kcal: 20 },
  ])('$what alone → $kj kJ / $kcal kcal (Annex XIV)', ({ n, kj, kcal }) => {
    const e = euEnergy({ ...none, ...n });
    expect(e.kj).toBeCloseTo(kj, 9);
    expect(e.kcal).toBeCloseTo(kcal, 9);
  });

  // Annex XIV, worked by hand: 20×37 + 50×17 + 6×17 + 2×8 = 1708 kJ;
  // 20×9 + 50×4 + 6×4 + 2×2 = 408 kcal.
  it('fat 20, carbohydrate 50, protein 6, fibre 2 g → 1708 kJ / 408 kcal', () => {
    const e = euEnergy({ ...none, fat: 20, carbohydrate: 50, protein: 6, fibre: 2 });
    expect(e.kj).toBeCloseTo(1708, 9);
    expect(e.kcal).toBeCloseTo(408, 9);
  });

  // Annex XIV gives kJ and kcal their own factors (37 kJ, 9 kcal per g of fat): fat 100 g → 3700 kJ /
  // 900 kcal, while 3700 ÷ 4.184 = 884.3.
  it('computes kcal from its own factors, not kJ ÷ 4.184', () => {
    const e = euEnergy({ ...none, fat: 100 });
    expect(e.kj).toBeCloseTo(3700, 9);
    expect(e.kcal).toBeCloseTo(900, 9);
    expect(Math.round(e.kj / 4.184)).toBe(884);
  });

  it.each([
    // Annex XIV: polyols 10 kJ / 2.4 kcal, erythritol 0; carbohydrate includes polyols (Annex I point 7):
    // 20×17 + 10×10 = 440 kJ; 20×4 + 10×2.4 = 104 kcal.
    { what: 'carbohydrate 30 g of which polyols 10 g', n: { carbohydrate: 30, polyols: 10 }, kj: 440, kcal: 104 },
    // 25×17 + 5×0 = 425 kJ; 25×4 = 100 kcal (erythritol is a polyol: not counted twice).
    {
      what: 'carbohydrate 30 g of which erythritol 5 g (polyols 5 g)',
      n: { carbohydrate: 30, polyols: 5, erythritol: 5 },
      kj: 425,
      kcal: 100,
    },
    // 20×17 + (12 − 4)×10 + 4×0 = 420 kJ; 20×4 + 8×2.4 = 99.2 kcal.
    {
      what: 'carbohydrate 32 g of which polyols 12 g, of which erythritol 4 g',
      n: { carbohydrate: 32, polyols: 12, erythritol: 4 },
      kj: 420,
      kcal: 99.2,
    },
    // Annex XIV: ethanol 29 kJ / 7 kcal per g → 10 g = 290 kJ / 70 kcal; organic acids 13 kJ / 3 kcal → 5 g = 65 kJ / 15 kcal.
    { what: 'alcohol 10 g', n: { alcohol: 10 }, kj: 290, kcal: 70 },
    { what: 'organic acids 5 g', n: { organicAcids: 5 }, kj: 65, kcal: 15 },
    // Annex XIV: salatrims 25 kJ / 6 kcal per g → 10 g = 250 kJ / 60 kcal (salatrims are lipids: part of the fat figure).
    { what: 'fat 10 g, all salatrims', n: { fat: 10, salatrims: 10 }, kj: 250, kcal: 60 },
    // 10×37 + 10×25 = 620 kJ; 10×9 + 10×6 = 150 kcal.
    { what: 'fat 20 g of which salatrims 10 g', n: { fat: 20, salatrims: 10 }, kj: 620, kcal: 150 },
  ])('$what → $kj kJ / $kcal kcal (Annex XIV)', ({ n, kj, kcal }) => {
    const e = euEnergy({ ...none, ...n });
    expect(e.kj).toBeCloseTo(kj, 9);
    expect(e.kcal).toBeCloseTo(kcal, 9);
  });

  it.each([
    { what: 'erythritol above polyols', n: { carbohydrate: 30, polyols: 2, erythritol: 5 } },
    { what: 'polyols above carbohydrate', n: { carbohydrate: 5, polyols: 10 } },
    { what: 'salatrims above fat', n: { fat: 5, salatrims: 10 } },
  ])('refuses contradictory figures: $what', ({ n }) => {
    expect(() => euEnergy({ ...none, ...n })).toThrow(/more than/);
  });
});

describe('US calories, general factors 4-4-9 of 21 CFR 101.9(c)(1)(i) (from memory)', () => {
  // 9×10 + 4×30 + 4×5 = 230 kcal.
  it('fat 10, total carbohydrate 30, protein 5 g → 230 kcal', () => {
    expect(usCalories({ fat: 10, totalCarbohydrate: 30, protein: 5, alcohol: 0 })).toBeCloseTo(230, 9);
  });
  // Ethanol at 7 kcal/g (Atwater general factor, from memory): 4×10 + 7×2 = 54 kcal.
  it('adds ethanol at 7 kcal/g', () => {
    expect(usCalories({ fat: 0, totalCarbohydrate: 10, protein: 0, alcohol: 2 })).toBeCloseTo(54, 9);
  });
});
