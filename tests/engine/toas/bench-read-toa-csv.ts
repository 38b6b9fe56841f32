/**
 * Speed of readToaCsv on a large file: 500 000 rows (~50 MB), the size the
 * arrival-time format promises to read "in a few seconds".
 * Run: npx tsx tests/engine/toas/bench-read-toa-csv.ts
 */
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';

const ROWS = 500_000;
const lines = ['mjd,uncertainty_us,frequency_mhz,observatory,backend,pulse_number,session,receiver_note'];
for (let i = 0; i < ROWS; i += 1) {
  const day = 55000 + Math.floor(i / 50);
  const frac = String(i * 7919 % 1_000_000_007).padStart(10, '0');
  lines.push(`${day}.${frac}1234567890123,${(0.5 + (i % 97) / 10).toFixed(3)},${1400 + (i % 13) * 10.5},harrow-ridge,wideband-${i % 3},${i * 1000},session-${Math.floor(i / 50)},"cal, ok"`);
}
const text = `${lines.join('\n')}\n`;
const bytes = new TextEncoder().encode(text);
const megabytes = bytes.length / 1e6;
const known = new Set(['harrow-ridge']);
for (const [label, input] of [['bytes', bytes], ['string', text]] as const) {
  const started = performance.now();
  const cpuStarted = process.cpuUsage();
  const result = readToaCsv(input, { knownObservatories: known });
  const seconds = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage(cpuStarted);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6; // CPU time: steadier than wall time on a shared machine
  if (!result.ok) throw new Error(`bench file rejected: ${result.errors[0].message}`);
  console.log(`${label}: ${result.toas.length} rows, ${megabytes.toFixed(1)} MB in ${seconds.toFixed(2)} s wall, ${cpuSeconds.toFixed(2)} s CPU (${(megabytes / seconds).toFixed(1)} MB/s wall)`);
}
