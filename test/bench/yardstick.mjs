// Speed yardstick for the simulator (JavaScript). A deliberately small time-domain model written the careful way:
// per set a one-axis machine (rotor angle, speed, E'q), a droop governor with one lag and a voltage regulator with
// reactive droop and one lag, all sets on a star network into a constant-impedance load, classical RK4 at 1 ms.
// State lives in Float64Arrays; the stepping loop allocates nothing and unrolls the complex sums.
// It models far less than Droopline's simulator (no dampers, isochronous/base-load modes, protection, recording);
// `npm run bench` runs it beside the simulator on the same machine as a floor the simulator should reach.
//
//   node test/bench/yardstick.mjs [sets=8] [steps=60000]
// prints one line: yardstick=js sets=… steps=… wall_s=… cpu_s=… set_steps_per_s=… cpu_set_steps_per_s=… check=…
const sets = Number(process.argv[2] ?? 8);
const steps = Number(process.argv[3] ?? 60000);
const h = 1e-3;
const PER = 5; // δ, ω, E'q, mechanical power, field voltage
const size = PER * sets;
const omegaS = 2 * Math.PI * 50;

// Per-set parameters as plain records, used as written in the model (divisions by the time constants and
// inertia, the terminal voltage magnitude with Math.hypot): the simple way a careful hand loop reads.
const par = [];
const yRe = new Float64Array(sets); // admittance of X'd plus the feeder, per set
const yIm = new Float64Array(sets);
for (let i = 0; i < sets; i++) {
  const p = { H: 1 + 0.05 * i, D: 2, xd: 2.5, xdp: 0.25, tdo: 3, R: 0.04, tg: 0.2, ka: 50, te: 0.1, kq: 0.04, vref: 1.05, pref: 0.6, r: 0.001, x: 0.01 };
  par.push(p);
  const x = p.x + p.xdp;
  const m2 = p.r * p.r + x * x;
  yRe[i] = p.r / m2;
  yIm[i] = -x / m2;
}
// The load: a constant admittance that grows with the number of sets.
const loadG = 0.6 * sets;
const loadB = -0.3 * sets;
const eRe = new Float64Array(sets);
const eIm = new Float64Array(sets);

/** dx/dt at state x, written into dx. */
function derivatives(x, dx) {
  let numRe = 0;
  let numIm = 0;
  let denRe = loadG;
  let denIm = loadB;
  for (let i = 0; i < sets; i++) {
    const o = PER * i;
    const mag = x[o + 2];
    const er = mag * Math.cos(x[o]);
    const ei = mag * Math.sin(x[o]);
    eRe[i] = er;
    eIm[i] = ei;
    const gr = yRe[i];
    const gi = yIm[i];
    numRe += er * gr - ei * gi;
    numIm += er * gi + ei * gr;
    denRe += gr;
    denIm += gi;
  }
  // Bus voltage = Σ Y E / (Σ Y + Y_load).
  const den2 = denRe * denRe + denIm * denIm;
  const vRe = (numRe * denRe + numIm * denIm) / den2;
  const vIm = (numIm * denRe - numRe * denIm) / den2;
  for (let i = 0; i < sets; i++) {
    const o = PER * i;
    const p = par[i];
    const delta = x[o];
    const slip = x[o + 1] - 1;
    const er = eRe[i];
    const ei = eIm[i];
    const gr = yRe[i];
    const gi = yIm[i];
    const ar = er - vRe;
    const ai = ei - vIm;
    const cr = ar * gr - ai * gi; // stator current
    const ci = ar * gi + ai * gr;
    const tr = er + p.xdp * ci; // terminal voltage E' − jX'd I
    const ti = ei - p.xdp * cr;
    const kvar = ti * cr - tr * ci;
    const pe = er * cr + ei * ci;
    const iD = cr * Math.sin(delta) - ci * Math.cos(delta);
    dx[o] = omegaS * slip;
    dx[o + 1] = (x[o + 3] - pe - p.D * slip) / (2 * p.H);
    dx[o + 2] = (x[o + 4] - x[o + 2] - (p.xd - p.xdp) * iD) / p.tdo;
    dx[o + 3] = (p.pref - slip / p.R - x[o + 3]) / p.tg;
    dx[o + 4] = (p.ka * (p.vref - Math.hypot(tr, ti) - p.kq * kvar) - x[o + 4]) / p.te;
  }
}

const x = new Float64Array(size);
const k1 = new Float64Array(size);
const k2 = new Float64Array(size);
const k3 = new Float64Array(size);
const k4 = new Float64Array(size);
const w = new Float64Array(size);
for (let i = 0; i < sets; i++) x.set([0.3, 1, 1.1, 0.6, 2.0], PER * i);

const cpu0 = process.cpuUsage();
const t0 = process.hrtime.bigint();
const half = 0.5 * h;
const sixth = h / 6;
for (let s = 0; s < steps; s++) {
  derivatives(x, k1);
  for (let j = 0; j < size; j++) w[j] = x[j] + half * k1[j];
  derivatives(w, k2);
  for (let j = 0; j < size; j++) w[j] = x[j] + half * k2[j];
  derivatives(w, k3);
  for (let j = 0; j < size; j++) w[j] = x[j] + h * k3[j];
  derivatives(w, k4);
  for (let j = 0; j < size; j++) x[j] += sixth * (k1[j] + 2 * k2[j] + 2 * k3[j] + k4[j]);
}
const wall = Number(process.hrtime.bigint() - t0) / 1e9;
const c = process.cpuUsage(cpu0);
const cpu = (c.user + c.system) / 1e6;
const work = sets * steps;
console.log(
  `yardstick=js sets=${sets} steps=${steps} wall_s=${wall.toFixed(4)} cpu_s=${cpu.toFixed(4)} set_steps_per_s=${(work / wall).toPrecision(4)} cpu_set_steps_per_s=${(work / cpu).toPrecision(4)} check=${x[1].toFixed(6)}`,
);
