// PLACEHOLDER until the table is generated
import type { MassiveRateTable } from './massiveRateTable.js';

/** placeholder */
export const SHIPPED_MASSIVE_RATE_TABLE: MassiveRateTable & { generatedBy: string; seconds: number } = {
  generatedBy: 'x',
  seconds: 0,
  aStar: [0, 0.3497593465632518, 0.6553367989832941, 0.8781315570584023, 0.99],
  theta: [0, 0.3573142133676173, 0.7146284267352346, 1.071942640102852, 1.4292568534704693],
  fieldMass: [0],
  spins: [
    {
      spin: 0,
      aStar: [0, 0.3497593465632518, 0.6553367989832941, 0.8781315570584023, 0.99],
      theta: [0, 0.3573142133676173, 0.7146284267352346, 1.071942640102852, 1.4292568534704693],
      powerRatio: [[1, 1, 1, 1, 1]],
      torqueRatio: [[1, 1, 1, 1, 1]],
      powerRatioError: [[0, 0, 0, 0, 0]],
      torqueRatioError: [[0, 0, 0, 0, 0]],
    },
    {
      spin: 0.5,
      aStar: [0, 0.3497593465632518, 0.6553367989832941, 0.8781315570584023, 0.99],
      theta: [0, 0.3573142133676173, 0.7146284267352346, 1.071942640102852, 1.4292568534704693],
      powerRatio: [[1, 1, 1, 1, 1]],
      torqueRatio: [[1, 1, 1, 1, 1]],
      powerRatioError: [[0, 0, 0, 0, 0]],
      torqueRatioError: [[0, 0, 0, 0, 0]],
    },
    {
      spin: 1,
      aStar: [0, 0.3497593465632518, 0.6553367989832941, 0.8781315570584023, 0.99],
      theta: [0, 0.3573142133676173, 0.7146284267352346, 1.071942640102852, 1.4292568534704693],
      powerRatio: [[1, 1, 1, 1, 1]],
      torqueRatio: [[1, 1, 1, 1, 1]],
      powerRatioError: [[0, 0, 0, 0, 0]],
      torqueRatioError: [[0, 0, 0, 0, 0]],
    },
  ],
  tol: 0.001,
  gammaCalls: 0,
};
