/**
 * `npm run bench`: the speed and precision targets, measured and printed with
 * figures and ratios to their targets (never asserted in timed tests).
 */
const suites = ['precision', 'barycentre', 'fit', 'periodogram', 'search', 'residual-store', 'upload', 'explorer'];
export {};
for (const name of suites) {
  console.log(`\n== ${name} ==`);
  const suite = (await import(`./bench/${name}.ts`)) as { bench: () => Promise<void> };
  await suite.bench();
}
