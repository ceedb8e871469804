import { describe, expect, test } from "vitest";
import { calibrateRates, type LoggedPiece } from "@/lib/core/labour/calibrate";
import { defaultRates, type LabourRates } from "@/lib/core/labour/default-rates";
import { fillPieceFeatures } from "@/lib/core/labour/piece-features";
import { fitRobustLogNnls, fitRobustNnls } from "@/lib/core/labour/robust-fit";
import { spreadFromLogRatios, studentT80, toleranceK, toleranceK80 } from "@/lib/core/labour/spread";
import { getStageMinutes } from "@/lib/core/labour/stage-model";
import { STAGES, type Stage } from "@/lib/core/labour/stages";
import { makeHistory, seededRandom, TRUE_RATES } from "./synthetic-history";

function normal(rnd: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
}

/** Pieces logged at exactly their true minutes (no rounding), so a fit must give the rates back exactly. */
function noiseless(count: number, seed: number): LoggedPiece[] {
  return makeHistory({ seed, count, noise: 0, outlierEvery: 0 }).map((p) => {
    const filled = fillPieceFeatures(p.features);
    const loggedMinutes: Partial<Record<Stage, number>> = {};
    for (const s of STAGES) {
      const m = getStageMinutes(s, filled, TRUE_RATES);
      if (m > 0) loggedMinutes[s] = m;
    }
    return { features: p.features, loggedMinutes };
  });
}

describe("log-space fit", () => {
  test("noiseless data: every rate recovered exactly (to 1e-6 relative)", () => {
    const r = calibrateRates(noiseless(30, 4));
    for (const key of Object.keys(TRUE_RATES) as (keyof LabourRates)[]) {
      if (key === "dryingHoursPerPiece") continue;
      expect(Math.abs(r.rates[key] / TRUE_RATES[key] - 1), key).toBeLessThan(1e-6);
    }
  });

  test("noiseless rows with an offset: coefficients exact, residuals zero", () => {
    const rnd = seededRandom(3);
    const x = Array.from({ length: 12 }, () => [1000 + rnd() * 5000, rnd() * 40]);
    const offset = x.map(() => 5 + rnd() * 10);
    const y = x.map((row, i) => offset[i] + row[0] / 30 + row[1] * 2.5);
    const fit = fitRobustLogNnls(x, y, { offset });
    expect(fit.coefficients[0]).toBeCloseTo(1 / 30, 12);
    expect(fit.coefficients[1]).toBeCloseTo(2.5, 9);
    for (const r of fit.logResiduals) expect(Math.abs(r)).toBeLessThan(1e-9);
  });

  // Under log-normal noise of σ = 0.5 the median of y is the true rate × x, its mean is e^(σ²/2) ≈ 1.13
  // above, and the old relative-error fit (weights 1/y) lands near e^(−1.5σ²) ≈ 0.69 below.
  test("log-normal noise σ = 0.5: the fit is a median (half the pieces at or below it), the 1/y fit runs low", () => {
    const rnd = seededRandom(17);
    const x: number[][] = [];
    const y: number[] = [];
    for (let i = 0; i < 2000; i++) {
      const stitches = 2000 + rnd() * 8000;
      x.push([stitches]);
      y.push((stitches / 30) * Math.exp(0.5 * normal(rnd)));
    }
    const log = fitRobustLogNnls(x, y, { weighting: "huber" }).coefficients[0];
    expect(Math.abs(log * 30 - 1)).toBeLessThan(0.03);
    const below = y.filter((v, i) => v <= x[i][0] * log).length / y.length;
    expect(below).toBeGreaterThan(0.47);
    expect(below).toBeLessThan(0.53);
    const old = fitRobustNnls(x, y, { rowScale: y.map((v) => 1 / v), weighting: "huber" }).coefficients[0];
    expect(old * 30).toBeLessThan(0.8);
  });

  test("a mislogged piece (timer left running) is rejected in log space too", () => {
    const x = [[1], [1], [1], [1], [1], [1], [1]];
    const y = [10, 10.4, 9.7, 10.2, 9.9, 10.1, 60];
    const fit = fitRobustLogNnls(x, y);
    expect(fit.weights[6]).toBe(0);
    expect(fit.coefficients[0]).toBeGreaterThan(9.8);
    expect(fit.coefficients[0]).toBeLessThan(10.3);
  });

  test("never negative: a term that only adds noise is fitted at 0, not below", () => {
    const rnd = seededRandom(8);
    const x = Array.from({ length: 30 }, () => [1000 + rnd() * 4000, rnd() * 50]);
    const y = x.map((row) => (row[0] / 25) * Math.exp(0.2 * normal(rnd)));
    const fit = fitRobustLogNnls(x, y);
    for (const c of fit.coefficients) expect(c).toBeGreaterThanOrEqual(0);
  });

  test("refuses a zero logged value (log space needs minutes > 0)", () => {
    expect(() => fitRobustLogNnls([[1], [2]], [3, 0])).toThrow(/greater than 0/);
  });
});

describe("P80 from leave-one-out ratios", () => {
  // t quantiles checked against a printed table (one-sided 0.80: ν=3 0.978, 5 0.920, 10 0.879,
  // 30 0.854; from memory) and by numerical integration of the t density while writing this.
  test.each([
    [1, 1.376],
    [2, 1.061],
    [3, 0.978],
    [5, 0.92],
    [10, 0.879],
    [30, 0.854],
    [1000, 0.842],
  ])("t₀.₈ with %i degrees of freedom is %f", (nu, t) => {
    expect(studentT80(nu)).toBeCloseTo(t, 3);
  });

  // Exact one-sided normal tolerance factors, 90 % content with 95 % confidence, as printed in
  // published tables (e.g. Natrella, NBS Handbook 91, Table A-7; values from memory): Natrella's
  // approximation is within 0.05 of them.
  test.each([
    [10, 2.355],
    [20, 1.926],
    [50, 1.646],
  ])("tolerance factor (90 %, 95 %) for n = %i is about %f", (n, k) => {
    expect(Math.abs(toleranceK(n, 1.2815515655446004, 1.6448536269514722) - k)).toBeLessThan(0.05);
  });

  test("the P80 allowance shrinks as the history grows, towards z₀.₈, and is wider than the prediction bound for short histories", () => {
    const ks = [3, 5, 8, 15, 40, 100, 10_000].map(toleranceK80);
    ks.slice(1).forEach((k, i) => expect(k).toBeLessThan(ks[i]));
    expect(Math.abs(ks.at(-1)! - 0.8416)).toBeLessThan(0.01);
    for (const n of [4, 8, 15, 40]) expect(toleranceK80(n)).toBeGreaterThan(studentT80(n - 1) * Math.sqrt(1 + 1 / n));
  });

  test("a tight history still gives a P80 of at least 1; a wide one a larger factor with fewer pieces", () => {
    expect(spreadFromLogRatios([-0.3, -0.2, -0.25, -0.3, -0.28], 1)!.p80Factor).toBe(1);
    const ratios = [-0.4, -0.2, 0, 0.1, 0.3, -0.1, 0.2, 0.05];
    const many = spreadFromLogRatios([...ratios, ...ratios, ...ratios], 2)!;
    const few = spreadFromLogRatios(ratios, 2)!;
    expect(few.p80Factor).toBeGreaterThan(many.p80Factor);
    expect(few.degreesOfFreedom).toBe(6);
    expect(spreadFromLogRatios([0.1], 1)).toBeNull();
  });

  test("with 40 pieces and ±10 % noise, every stage's factor comes from history and its median ratio is near 1", () => {
    const r = calibrateRates(makeHistory({ seed: 3, count: 40, noise: 0.1, outlierEvery: 0 }));
    for (const s of STAGES) {
      expect(r.stages[s].spread).not.toBeNull();
      expect(r.stages[s].spread!.pieces).toBeGreaterThanOrEqual(38);
      expect(Math.abs(r.stages[s].spread!.medianRatio - 1)).toBeLessThan(0.05);
    }
  });
});

describe("calibration boundaries", () => {
  test("beyond 60 pieces the spread comes from ten folds: every unrejected piece still gets one out-of-sample ratio", () => {
    const r = calibrateRates(makeHistory({ seed: 31, count: 80, noise: 0.1, outlierEvery: 0 }));
    for (const s of STAGES) {
      expect(r.stages[s].pieces).toBeGreaterThan(60);
      expect(r.stages[s].spread!.pieces).toBeGreaterThanOrEqual(r.stages[s].pieces - 2);
      expect(r.stages[s].spread!.pieces).toBeLessThanOrEqual(r.stages[s].pieces);
      expect(r.p80Factors[s]).toBeGreaterThanOrEqual(1);
      expect(r.p80Factors[s]).toBeLessThan(1.15);
    }
  });


  test("fewer pieces than the minimum: base rates, the default P80, no spread, and a note saying so", () => {
    const r = calibrateRates(makeHistory({ seed: 9, count: 4, noise: 0.1, outlierEvery: 0 }), { minPieces: 6 });
    expect(r.rates).toEqual({ ...defaultRates });
    for (const s of STAGES) {
      expect(r.stages[s].fitted).toBe(false);
      expect(r.stages[s].p80Source).toBe("default");
      expect(r.stages[s].spread).toBeNull();
      expect(r.p80Factors[s]).toBe(1.25);
    }
    expect(r.notes.join("\n")).toMatch(/P80 margin stays at the default ×1\.25/);
  });

  test("one stage never logged: its rates and P80 stay at the base, its coverage is null, the others are fitted", () => {
    const history = makeHistory({ seed: 12, count: 30, noise: 0.1, outlierEvery: 0 }).map((p) => {
      const { embroidery: _dropped, ...rest } = p.loggedMinutes;
      return { ...p, loggedMinutes: rest };
    });
    const r = calibrateRates(history, { baseRates: { minutesPerEnd: 5 } });
    expect(r.stages.embroidery).toMatchObject({ pieces: 0, fitted: false, p80Source: "default", spread: null });
    expect(r.rates.minutesPerEnd).toBe(5);
    expect(r.p80Factors.embroidery).toBe(1.25);
    expect(r.stages.knitting.fitted).toBe(true);
    expect(r.accuracy!.stages.embroidery).toMatchObject({ pieces: 0, p50Coverage: null, p80Coverage: null });
    expect(r.accuracy!.stages.knitting.p80Coverage).not.toBeNull();
  });

  test("the accuracy report gives P50 and P80 coverage of the held-back pieces, per stage and overall", () => {
    const r = calibrateRates(makeHistory({ seed: 14, count: 50, noise: 0.1, outlierEvery: 0 }));
    const acc = r.accuracy!;
    expect(acc.heldBackPieces).toBe(10);
    for (const s of [...STAGES.map((st) => acc.stages[st]), acc.overall]) {
      expect(s.p50Coverage).toBeGreaterThanOrEqual(0);
      expect(s.p80Coverage!).toBeGreaterThanOrEqual(s.p50Coverage!);
      expect(s.p80Coverage).toBeLessThanOrEqual(100);
    }
  });
});
