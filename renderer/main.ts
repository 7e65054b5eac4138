/**
 * The page's script. It starts the engine (the Web Worker in the preview) and asks it to check the demo plant, then
 * loads the app: the engine's code downloads, compiles and answers beside the app's own code instead of after it, so
 * the first figure shows sooner. The plant store takes that answer when it loads the demo (see `transport/early.ts`).
 */
import demoPlant from './demo/water-works.plant.json';
import { engine, keepDemoCheck } from './transport';

keepDemoCheck(engine().call('checkPlant', { plant: structuredClone(demoPlant) }));
void import('./app');
