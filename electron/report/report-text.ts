/** The fixed wording of every report: the definitions used and the cautions (the same definitions as the README's). */

/** One definition: the term and what Droopline means by it. */
export interface Definition {
  term: string;
  text: string;
}

/** Definitions the report's numbers rest on. */
export const DEFINITIONS: readonly Definition[] = [
  {
    term: 'Speed droop',
    text: 'R = 100 × (f_nl − f_fl) / f_r (%), where f_nl is the no-load frequency setting, f_fl the frequency at rated active power and f_r the rated frequency (Hz). A set in droop delivers P = P_r × (f_nl − f) / (R/100 × f_r) at bus frequency f, within its limits (P_r: rated active power, kW).',
  },
  {
    term: 'Isochronous and base load',
    text: 'An isochronous set holds its setpoint frequency; isochronous sets share the remainder in proportion to rated kW. A base-load set gives its base kW.',
  },
  {
    term: 'Reactive droop',
    text: 'V = V_nl − R_Q/100 × V_r × Q / Q_base, with Q_base = S_r × √(1 − cos²φ_r) (kVAR), the reactive power at rated current and rated power factor. V_nl: no-load voltage setting, V_r: rated line-to-line voltage (V); S_r: rated apparent power (kVA); cos φ_r: rated power factor; R_Q: reactive droop (%).',
  },
  {
    term: 'Cross-current compensation',
    text: 'Cross-current sets hold their setpoint voltage and share kVAR in proportion to rated kVA. Two or more sets holding voltage with neither droop nor cross-current have no defined split.',
  },
  {
    term: 'Circulating current',
    text: "A set's reactive current minus its proportional (rated-kVA-weighted) share of the total reactive current; the circulating currents sum to zero.",
  },
  { term: 'Sign convention', text: 'Generator convention: kW > 0 delivered to the bus; kVAR > 0 is lagging (over-excited).' },
  {
    term: 'Rated speed and current',
    text: 'n = 120 f / p (rpm), p the number of poles. Rated current I_r = S_r / (√3 V_r) (A), V_r line-to-line; currents are given to the ampere.',
  },
  {
    term: 'Slip and phase angle',
    text: 'Slip s = f_incoming − f_bus (Hz); slip period 1/|s|; the phase angle of the incoming set advances 360 s degrees a second.',
  },
  {
    term: 'Advance angle and window',
    text: 'Advance angle for a breaker closing time t: 360 s t degrees. A window of ±A degrees stays open 2A / (360 |s|) seconds per slip cycle.',
  },
  {
    term: 'Closing surge',
    text: '|ΔV| = √(V1² + V2² − 2 V1 V2 cos θ); subtransient surge |ΔV| / (X″d incoming + X of the running bus); peak with DC offset from the IEC 60909 factor κ = 1.02 + 0.98 e^(−3R/X) times √2. Synchronizing power (V1 V2 / X) sin θ.',
  },
  {
    term: 'Transient metrics',
    text: "Frequency nadir and peak, transient deviation from rated (%), recovery time into the steady-state band, voltage dip and peak (% of rated), voltage recovery time; verdicts against the ISO 8528-5 performance classes (class G1, class G2 and class G3) with each limit's source named beside it.",
  },
  {
    term: 'Sharing table loads',
    text: "Percent points are of the online sets' rated kW, at the stated load power factor, as one constant-power load replacing the plant's own loads; \"connected load\" uses the plant's own loads.",
  },
];

/** The cautions every report carries. */
export const CAUTIONS: readonly string[] = [
  'For planning and training only.',
  "Verify every setting against the makers' data, protection studies, local codes and licensed practice before it is used on equipment.",
  'Closing out of phase can damage machines and injure people.',
  "Limit presets name their source; where a standard's table could not be confirmed, verify against the standard you hold.",
];
