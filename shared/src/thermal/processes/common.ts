import type { ComputationWarning } from '../../chemistry/types';
import type { ChemistryPort } from '../chemistry-port';
import type { ProcessKind } from '../process';

/**
 * What every process module of the pack model shares: the warnings collector, the heat
 * capacity and mass breakdowns, and the view of the state each module reads (the liquid water
 * and the solution's composition are properties of the whole pack, not of one process).
 */

/** Collects warnings once per code and subject, so a long integration does not repeat them. */
export class WarningCollector {
  private readonly seen = new Map<string, ComputationWarning>();

  add(warning: ComputationWarning, subject = ''): void {
    const id = `${warning.code}|${subject}`;
    if (!this.seen.has(id)) this.seen.set(id, warning);
  }

  addAll(warnings: readonly ComputationWarning[], subject = ''): void {
    for (const w of warnings) this.add(w, subject);
  }

  list(): ComputationWarning[] {
    return [...this.seen.values()];
  }
}

/** The chemistry port and the warnings of one pack model, handed to each process module. */
export interface ModelContext {
  port: ChemistryPort;
  warnings: WarningCollector;
}

export interface ProcessRef {
  label: string;
  kind: ProcessKind | 'freezing' | 'precipitation' | 'hydrate-melting' | 'ice-melting' | 'boiling';
}

/** Heat capacity of each kind of part, J/K. */
export interface HeatCapacityParts {
  solution: number;
  undissolvedSolids: number;
  ice: number;
  reactionSolids: number;
  melt: number;
  metalAndOxide: number;
  inert: number;
  packaging: number;
}

export interface MassInventory {
  solutionG: number;
  undissolvedG: number;
  iceG: number;
  reactionSolidsG: number;
  meltG: number;
  metalAndOxideG: number;
  inertG: number;
  /** Taken up from air (O2) or drawn from other components (excess reactants). */
  gainedG: number;
  /** Evolved as gas and left the pack. */
  lostAsGasG: number;
  /** Water boiled off as steam that left the pack. */
  steamLostG: number;
}

export function emptyParts(packagingJPerK: number): HeatCapacityParts {
  return { solution: 0, undissolvedSolids: 0, ice: 0, reactionSolids: 0, melt: 0, metalAndOxide: 0, inert: 0, packaging: packagingJPerK };
}

export function emptyInventory(): MassInventory {
  return { solutionG: 0, undissolvedG: 0, iceG: 0, reactionSolidsG: 0, meltG: 0, metalAndOxideG: 0, inertG: 0, gainedG: 0, lostAsGasG: 0, steamLostG: 0 };
}

/** The phase tag of a species key `formula(phase)`, or null. */
export function phaseOf(key: string): string | null {
  const m = /\((cr|l|g|aq|ai|ao)\)$/.exec(key);
  return m ? m[1]! : null;
}
