import type { OptimisationResult } from '../schemas/briefs';

/** How many of a run's simulated sets meet the brief with their corrected optimum. */
export interface CorrectedPassShare {
  /** Sets whose (corrected) optimum meets the brief in simulation. */
  passed: number;
  /** Sets feasible in the linear model and simulated (passed, missed or failed). */
  simulated: number;
  /** passed / simulated; null when nothing was simulated. */
  share: number | null;
}

/**
 * The share of sets whose corrected optimum passes (DEVELOPERS.md, "Optimiser: closing the
 * loop"): every listed candidate is one set's optimum after at most MAX_CORRECTION_ROUNDS
 * corrections, simulated with the time model. Summed over several runs with {@link sumPassShares}.
 *
 * @example correctedPassShare(run) // → { passed: 7, simulated: 9, share: 0.778 }
 */
export function correctedPassShare(result: Pick<OptimisationResult, 'candidates'>): CorrectedPassShare {
  const simulated = result.candidates.filter((c) => c.verification.status !== 'not-verified').length;
  const passed = result.candidates.filter((c) => c.verification.status === 'passed').length;
  return { passed, simulated, share: simulated > 0 ? passed / simulated : null };
}

export function sumPassShares(shares: readonly CorrectedPassShare[]): CorrectedPassShare {
  const passed = shares.reduce((a, s) => a + s.passed, 0);
  const simulated = shares.reduce((a, s) => a + s.simulated, 0);
  return { passed, simulated, share: simulated > 0 ? passed / simulated : null };
}
