/**
 * npm run bench:diagram — layout + SVG render of a generated 40-part circuit (two relay circuits, six
 * switched lamp columns, a 5 V reference through a connector). Prints the first call and the warm
 * median, then one JSON line {"layout_ms", "first_ms"}. Goals: warm <= 100 ms, first <= 600 ms.
 */
import { performance } from 'node:perf_hooks';
import { layoutCircuit, readDiagramCircuit, renderSvg } from '../src/lib/diagram/index';
import { benchCircuit } from '../src/lib/diagram/bench-circuit';


const { diagram } = readDiagramCircuit(benchCircuit());
if (diagram.parts.length !== 40) throw new Error(`bench circuit has ${diagram.parts.length} parts, expected 40`);

const once = () => renderSvg(layoutCircuit(diagram, { state: 'all-on' })).length;
let t = performance.now();
const bytes = once();
const first = performance.now() - t;
const runs: number[] = [];
for (let i = 0; i < 30; i++) {
	t = performance.now();
	once();
	runs.push(performance.now() - t);
}
runs.sort((a, b) => a - b);
const median = runs[Math.floor(runs.length / 2)];
const r = (n: number) => Math.round(n * 100) / 100;
console.log(`circuit: ${diagram.parts.length} parts, ${diagram.wires.length} wires; SVG ${bytes} bytes`);
console.log(`first layout + render: ${r(first)} ms (goal <= 600 ms)`);
console.log(`warm median of ${runs.length}: ${r(median)} ms (goal <= 100 ms); fastest ${r(runs[0])} ms, slowest ${r(runs[runs.length - 1])} ms`);
console.log(JSON.stringify({ layout_ms: r(median), first_ms: r(first) }));
