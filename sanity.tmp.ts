import { readFileSync } from 'node:fs';
import { parseTsplib, tsplibMatrix } from './packages/domain/src/routes/tsplib';
import { planTour } from './packages/domain/src/routes/tour-planner';
import { seededRandom } from './packages/domain/src/routes/seeded-random';
const inst: [string, number[][], number][] = [];
for (const [f, opt] of [['berlin52', 7542], ['eil51', 426]] as const) inst.push([f, tsplibMatrix(parseTsplib(readFileSync(`packages/domain/test-data/${f}.tsp`, 'utf8'))), opt]);
for (const n of [100, 200]) {
  const r = seededRandom(n); const pts = Array.from({length:n},()=>({x:r()*1000,y:r()*1000}));
  inst.push([`rand${n}`, pts.map(a=>pts.map(b=>Math.hypot(a.x-b.x,a.y-b.y))), 0]);
}
planTour(inst[0]![1]); // warm
for (const [name, m, opt0] of inst) {
  const ref = opt0 || Math.min(...[1,2,3].map(seed=>planTour(m,{seed,kicks:20000}).length));
  for (const kicks of [100, 300, 1000, 3000]) {
    const res = [1,2,3,4,5].map(seed=>{const t=performance.now(); const L=planTour(m,{seed,kicks}).length; return [L, performance.now()-t];});
    console.log(name, kicks, 'gap% ' + res.map(([L])=>((L!/ref-1)*100).toFixed(2)).join(' '), 'ms ' + res.map(([,t])=>t!.toFixed(0)).join(' '));
  }
}
