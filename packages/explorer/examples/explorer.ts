import { buildExplorer, computeView, parseState, printNumber } from '@penumbra/explorer';

// The page's greybody view, computed in Node exactly as the page's worker does:
// Γ of the s = 2, l = m = 2 mode of an a = 0.99 hole at three frequencies.
const view = computeView(parseState('?view=greybody&a=0.99&spin=2&l=2&m=2&from=0.3&to=0.9&count=3'));
for (const [l, m, omega, gamma] of view.rows) console.log(`l = ${l}, m = ${m}, Mω = ${omega}: Γ = ${printNumber(gamma)}`);
console.log(view.summary.join('\n'));

// The page as a static folder any web server can host (the `penumbra explore --out DIR` command).
const dir = await buildExplorer(`${process.env.TMPDIR ?? '/tmp'}/penumbra-explorer-example`);
console.log(`built into ${dir}`);
