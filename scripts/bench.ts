// `npm run bench`: the term engine's speed and memory figures (not tests; they depend on the machine).
import { main as benchTerms } from './bench-terms';
import { main as benchMatcher } from './bench-matcher';

console.log('== Term engine: generating-function counting against explicit enumeration ==');
benchTerms();
console.log('\n== Exact Wigner symbols at the API limits, and jj levels ==');
await import('./bench-wigner');
console.log('\n== Energy solver: intermediate-coupling levels ==');
(await import('./bench-energy')).main();
console.log('\n== Line matcher: sorted transitions and binary search against brute force ==');
benchMatcher();
