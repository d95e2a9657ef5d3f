// PLACEHOLDER until the table is generated
import type { MassiveRateTable } from './massiveRateTable.js';

/** placeholder */
export const SHIPPED_MASSIVE_RATE_TABLE: MassiveRateTable & { generatedBy: string; seconds: number } = {
  generatedBy: 'x',
  seconds: 0,
  aStar: [
    0, 0.1777082152761199, 0.3497593465632518, 0.5106763949585627, 0.6553367989832941, 0.7791355039179597, 0.8781315570584023,
    0.9491735622447783, 0.99,
  ],
  theta: [
    0, 0.17865710668380866, 0.3573142133676173, 0.535971320051426, 0.7146284267352346, 0.8932855334190433, 1.071942640102852,
    1.2505997467866605, 1.4292568534704693,
  ],
  fieldMass: [0],
  spins: [
    {
      spin: 0,
      powerRatio: [[1, 1, 1, 1, 1, 1, 1, 1, 1]],
      torqueRatio: [[1, 1, 1, 1, 1, 1, 1, 1, 1]],
      powerRatioError: [[0, 0, 0, 0, 0, 0, 0, 0, 0]],
      torqueRatioError: [[0, 0, 0, 0, 0, 0, 0, 0, 0]],
    },
    {
      spin: 0.5,
      powerRatio: [[1, 1, 1, 1, 1, 1, 1, 1, 1]],
      torqueRatio: [[1, 1, 1, 1, 1, 1, 1, 1, 1]],
      powerRatioError: [[0, 0, 0, 0, 0, 0, 0, 0, 0]],
      torqueRatioError: [[0, 0, 0, 0, 0, 0, 0, 0, 0]],
    },
    {
      spin: 1,
      powerRatio: [[1, 1, 1, 1, 1, 1, 1, 1, 1]],
      torqueRatio: [[1, 1, 1, 1, 1, 1, 1, 1, 1]],
      powerRatioError: [[0, 0, 0, 0, 0, 0, 0, 0, 0]],
      torqueRatioError: [[0, 0, 0, 0, 0, 0, 0, 0, 0]],
    },
  ],
  tol: 0.0001,
  gammaCalls: 0,
};
