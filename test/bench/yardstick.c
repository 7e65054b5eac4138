/* Speed yardstick for the simulator (C): the same small model and RK4 as test/bench/yardstick.mjs — per set a
   one-axis machine, a droop governor with one lag and a voltage regulator with reactive droop and one lag, all sets
   on a star network into a constant-impedance load, RK4 at 1 ms — in plain C with flat double arrays.
   `npm run bench` compiles it when a C compiler (`cc`) is on the path:
     cc -O3 -march=native -ffast-math test/bench/yardstick.c -lm -o out/yardstick && out/yardstick [sets] [steps]
   and prints one line in the same form as the JavaScript one. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#define PER 5 /* δ, ω, E'q, mechanical power, field voltage */

static int sets;
typedef struct { double H, D, xd, xdp, tdo, R, tg, ka, te, kq, vref, pref, r, x; } Set;
static Set *par;
static double *yRe, *yIm, *eRe, *eIm;
static double loadG, loadB;

static void derivatives(const double *x, double *dx) {
  const double omegaS = 2 * M_PI * 50;
  double numRe = 0, numIm = 0, denRe = loadG, denIm = loadB;
  for (int i = 0; i < sets; i++) {
    const double *s = x + PER * i;
    double er = s[2] * cos(s[0]), ei = s[2] * sin(s[0]);
    eRe[i] = er;
    eIm[i] = ei;
    numRe += er * yRe[i] - ei * yIm[i];
    numIm += er * yIm[i] + ei * yRe[i];
    denRe += yRe[i];
    denIm += yIm[i];
  }
  double den2 = denRe * denRe + denIm * denIm;
  double vRe = (numRe * denRe + numIm * denIm) / den2, vIm = (numIm * denRe - numRe * denIm) / den2;
  for (int i = 0; i < sets; i++) {
    const double *s = x + PER * i;
    const Set *p = par + i;
    double *d = dx + PER * i;
    double slip = s[1] - 1;
    double ar = eRe[i] - vRe, ai = eIm[i] - vIm;
    double cr = ar * yRe[i] - ai * yIm[i], ci = ar * yIm[i] + ai * yRe[i];
    double tr = eRe[i] + p->xdp * ci, ti = eIm[i] - p->xdp * cr;
    double kvar = ti * cr - tr * ci;
    double pe = eRe[i] * cr + eIm[i] * ci;
    double iD = cr * sin(s[0]) - ci * cos(s[0]);
    d[0] = omegaS * slip;
    d[1] = (s[3] - pe - p->D * slip) / (2 * p->H);
    d[2] = (s[4] - s[2] - (p->xd - p->xdp) * iD) / p->tdo;
    d[3] = (p->pref - slip / p->R - s[3]) / p->tg;
    d[4] = (p->ka * (p->vref - sqrt(tr * tr + ti * ti) - p->kq * kvar) - s[4]) / p->te;
  }
}

int main(int argc, char **argv) {
  sets = argc > 1 ? atoi(argv[1]) : 8;
  int steps = argc > 2 ? atoi(argv[2]) : 60000;
  if (sets < 1 || steps < 1) { fprintf(stderr, "usage: yardstick [sets >= 1] [steps >= 1]\n"); return 2; }
  const double h = 1e-3;
  int size = PER * sets;
  par = calloc(sets, sizeof(Set));
  yRe = calloc(sets, sizeof(double)); yIm = calloc(sets, sizeof(double));
  eRe = calloc(sets, sizeof(double)); eIm = calloc(sets, sizeof(double));
  double *x = calloc(size, sizeof(double)), *k1 = calloc(size, sizeof(double)), *k2 = calloc(size, sizeof(double));
  double *k3 = calloc(size, sizeof(double)), *k4 = calloc(size, sizeof(double)), *w = calloc(size, sizeof(double));
  for (int i = 0; i < sets; i++) {
    par[i] = (Set){1 + 0.05 * i, 2, 2.5, 0.25, 3, 0.04, 0.2, 50, 0.1, 0.04, 1.05, 0.6, 0.001, 0.01};
    double xx = par[i].x + par[i].xdp, m2 = par[i].r * par[i].r + xx * xx;
    yRe[i] = par[i].r / m2;
    yIm[i] = -xx / m2;
    double init[PER] = {0.3, 1, 1.1, 0.6, 2.0};
    for (int k = 0; k < PER; k++) x[PER * i + k] = init[k];
  }
  loadG = 0.6 * sets;
  loadB = -0.3 * sets;
  struct timespec a, b;
  clock_t c0 = clock();
  clock_gettime(CLOCK_MONOTONIC, &a);
  const double half = 0.5 * h, sixth = h / 6;
  for (int s = 0; s < steps; s++) {
    derivatives(x, k1);
    for (int j = 0; j < size; j++) w[j] = x[j] + half * k1[j];
    derivatives(w, k2);
    for (int j = 0; j < size; j++) w[j] = x[j] + half * k2[j];
    derivatives(w, k3);
    for (int j = 0; j < size; j++) w[j] = x[j] + h * k3[j];
    derivatives(w, k4);
    for (int j = 0; j < size; j++) x[j] += sixth * (k1[j] + 2 * k2[j] + 2 * k3[j] + k4[j]);
  }
  clock_gettime(CLOCK_MONOTONIC, &b);
  double cpu = (double)(clock() - c0) / CLOCKS_PER_SEC;
  double wall = (b.tv_sec - a.tv_sec) + 1e-9 * (b.tv_nsec - a.tv_nsec);
  double work = (double)sets * steps;
  printf("yardstick=c sets=%d steps=%d wall_s=%.4f cpu_s=%.4f set_steps_per_s=%.4g cpu_set_steps_per_s=%.4g check=%.6f\n", sets, steps, wall, cpu, work / wall,
         work / cpu, x[1]);
  return 0;
}
