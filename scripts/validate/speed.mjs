// Section: speed against the scipy peer, from the latest benchmark results
// (read, not recomputed here).
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { mdTable, rel, sig, spinLabel } from './format.mjs';

export function speedSection(root) {
  return { title: 'Speed against a scipy peer', body: speedText(root) };
}

function speedText(root) {
  const dir = join(root, 'bench', 'results');
  const files = existsSync(dir)
    ? readdirSync(dir)
        .filter((f) => /^greybody-\d{4}-\d{2}-\d{2}\.json$/.test(f))
        .sort()
    : [];
  if (files.length === 0) return 'No benchmark results yet: run `npm run bench`.';
  const file = files[files.length - 1];
  const run = JSON.parse(readFileSync(join(dir, file), 'utf8'));
  const defaultRun = run.penumbraRuns?.[0]?.label;
  const peerLabels = (run.peerRuns ?? []).map((r) => r.label);
  const rows = (run.summary ?? []).map((s) => {
    const p = s.penumbra[defaultRun];
    const ms = (x) => x.cpuMsPerMode ?? x.msPerMode;
    const cells = [
      spinLabel(s.spin),
      s.modes,
      sig(ms(p), 3),
      Math.round(p.rhsEvaluationsPerMode),
      `${rel(p.medianRelError)} / ${rel(p.maxRelError)}`,
    ];
    for (const label of peerLabels) {
      const q = s.peer?.[label];
      cells.push(
        q
          ? `${sig(ms(q), 3)} (${sig(ms(q) / ms(p), 3)}×), ${Math.round(q.rhsEvaluationsPerMode)} evals, ${rel(q.medianRelError)} / ${rel(q.maxRelError)}`
          : '—',
      );
    }
    return cells;
  });
  return `From \`bench/results/${file}\` (\`npm run bench\`; ${run.cpu ?? 'cpu'} × ${run.cpus ?? '?'}, Node ${run.node},
load average ${(run.loadAverage ?? []).map((x) => x.toFixed(1)).join(' ') || 'n/a'} when the run ended; timings on a shared machine vary by tens of per cent).
Medians per mode over a fixed set of 36 modes per spin (a = 0, 0.7, 0.99; three (l, m); Mω = 0.05, 0.3, 0.8, 2).
Penumbra at its default tolerance (1e-8, eigenvalue solve included in its time);
the scipy peer (bench/peers/greybody_peer.py, DOP853, the spheroidal eigenvalue given) at several rtol.
Errors are relative to penumbra at tolerance 1e-12 (median / max).
${run.peerSkipped ? `\n**Peer skipped:** ${run.peerSkipped}\n` : ''}
${mdTable(['s', 'modes', 'penumbra CPU ms', 'penumbra RHS evals', 'penumbra error', ...peerLabels.map((l) => `${l}: CPU ms (ratio), evals, error`)], rows)}

CPU time per mode (median over the modes; wall-clock figures are in the results file). Per RHS evaluation
the peer costs far more (Python), while penumbra spends more evaluations per mode: it solves at 1e-3 of the
requested tolerance, repeats the solve at a ten times looser tolerance for its error estimate, and adds an
independent −s solve for the reflection coefficient.`;
}
