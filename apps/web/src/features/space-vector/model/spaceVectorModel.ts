import {
  spaceVectorSequence,
  SIX_STEP_M,
  type SpaceVectorSequence,
  type SpaceVectorSequenceKind,
  type ZeroVectorClamping,
} from '@pulsewright/modulation';

// The page runs the library in the browser so the hexagon follows the slider without a round
// trip; the service's POST /api/v1/space-vector gives scripts the same sequence.

export interface SpaceVectorInput {
  m: number;
  thetaDegrees: number;
  sequence: SpaceVectorSequenceKind;
  clamping: ZeroVectorClamping;
}

export function sequenceFor(input: SpaceVectorInput): {
  result: SpaceVectorSequence | null;
  error: string | null;
} {
  try {
    return {
      result: spaceVectorSequence(
        { m: input.m, theta: (input.thetaDegrees * Math.PI) / 180 },
        { sequence: input.sequence, clamping: input.clamping },
      ),
      error: null,
    };
  } catch (error) {
    return { result: null, error: error instanceof Error ? error.message : String(error) };
  }
}

/** The largest m the page's slider offers (six-step, from the library). */
export const MAX_M = SIX_STEP_M;
