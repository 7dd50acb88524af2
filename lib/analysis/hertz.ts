/**
 * Hertz point contact (Johnson, Contact Mechanics, CUP 1985, §3–§4; Roark's Formulas for Stress and
 * Strain, Table 14.1). Elliptical contacts by the exact complete-elliptic-integral solution of Johnson
 * §4.2; the integrals by the arithmetic–geometric mean (mathjs has no elliptic integrals, and the AGM is
 * a few lines with quadratic convergence). Hamrock & Brewe's approximation is kept for cross-checks.
 * SI units throughout (N, m, Pa).
 */

/** Complete elliptic integrals K(e), E(e) of modulus e (0 ≤ e < 1) by the AGM (Abramowitz & Stegun 17.6). */
export function ellipticKE(e: number): { K: number; E: number } {
  let a = 1;
  let g = Math.sqrt(1 - e * e);
  let c = e;
  let sum = 0.5 * c * c; // 2^(n−1) c_n² for n = 0
  let pow = 0.5;
  for (let i = 0; i < 60 && Math.abs(c) > 1e-17; i++) {
    const an = (a + g) / 2;
    const gn = Math.sqrt(a * g);
    c = (a - g) / 2;
    a = an;
    g = gn;
    pow *= 2;
    sum += pow * c * c;
  }
  const K = Math.PI / (2 * a);
  return { K, E: K * (1 - sum) };
}

export interface HertzInput {
  /** principal radii of the two bodies in m, null = flat, negative = concave */
  radii: [[number | null, number | null], [number | null, number | null]];
  angleDeg: number;
  E1: number;
  nu1: number;
  E2: number;
  nu2: number;
  /** normal force, N (> 0) */
  force: number;
}

export interface HertzResult {
  /** contact modulus E* (Pa) */
  Estar: number;
  /** principal relative radii R′ ≥ R″ (m) and the effective radius √(R′R″) */
  Rmax: number;
  Rmin: number;
  Reff: number;
  /** semi-axes a ≥ b (m) */
  a: number;
  b: number;
  /** maximum pressure (Pa), approach (m), tangent stiffness dF/dδ (N/m), secant F/δ (N/m) */
  p0: number;
  delta: number;
  tangent: number;
  secant: number;
  /** a/b */
  ellipticity: number;
}

/** Relative curvatures A ≤ B (1/m) of two bodies with principal curvatures at an angle (Johnson eq. 4.12–4.13). */
export function relativeCurvatures(radii: HertzInput["radii"], angleDeg: number): { A: number; B: number } {
  const k = (r: number | null) => (r === null ? 0 : 1 / r);
  const [k1, k2] = [k(radii[0][0]), k(radii[0][1])];
  const [l1, l2] = [k(radii[1][0]), k(radii[1][1])];
  const phi = (angleDeg * Math.PI) / 180;
  const sum = 0.5 * (k1 + k2 + l1 + l2); // A + B
  const d1 = k1 - k2;
  const d2 = l1 - l2;
  const diff = 0.5 * Math.sqrt(Math.max(0, d1 * d1 + d2 * d2 + 2 * d1 * d2 * Math.cos(2 * phi))); // B − A
  return { A: (sum - diff) / 2, B: (sum + diff) / 2 };
}

/** Contact modulus 1/E* = (1 − ν1²)/E1 + (1 − ν2²)/E2. */
export const contactModulus = (E1: number, nu1: number, E2: number, nu2: number) => 1 / ((1 - nu1 * nu1) / E1 + (1 - nu2 * nu2) / E2);

/** The exact Hertz solution for a point contact. Throws when the surfaces do not make a point contact. */
export function hertzContact(input: HertzInput): HertzResult {
  const { A, B } = relativeCurvatures(input.radii, input.angleDeg);
  if (!(A > 0) || !(B > 0)) throw new Error("the surfaces do not make a point contact (a relative curvature is zero or negative)");
  const Estar = contactModulus(input.E1, input.nu1, input.E2, input.nu2);
  const P = input.force;
  const Rmax = 1 / (2 * A);
  const Rmin = 1 / (2 * B);
  const ratio = B / A;
  let e: number;
  let a: number;
  let b: number;
  let p0: number;
  let delta: number;
  if (ratio - 1 < 1e-12) {
    const R = 1 / (A + B);
    a = Math.cbrt((3 * P * R) / (4 * Estar));
    b = a;
    p0 = (3 * P) / (2 * Math.PI * a * a);
    delta = (a * a) / R;
  } else {
    // B/A = [(a/b)² E(e) − K(e)] / [K(e) − E(e)], e² = 1 − b²/a² (Johnson eq. 4.39); solve for e by bisection
    const f = (ee: number) => {
      const { K, E } = ellipticKE(ee);
      return ((1 / (1 - ee * ee)) * E - K) / (K - E) - ratio;
    };
    let lo = 1e-9;
    let hi = 1 - 1e-16;
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (f(mid) > 0) hi = mid;
      else lo = mid;
      if (hi - lo < 1e-16) break;
    }
    e = (lo + hi) / 2;
    const { K, E } = ellipticKE(e);
    a = Math.cbrt((3 * P * (K - E)) / (2 * Math.PI * Estar * e * e * A));
    b = a * Math.sqrt(1 - e * e);
    p0 = (3 * P) / (2 * Math.PI * a * b);
    delta = (p0 * b * K) / Estar;
  }
  return {
    Estar,
    Rmax,
    Rmin,
    Reff: Math.sqrt(Rmax * Rmin),
    a,
    b,
    p0,
    delta,
    tangent: (1.5 * P) / delta,
    secant: P / delta,
    ellipticity: a / b,
  };
}

/** Hamrock & Brewe (J. Lubrication Tech. 105, 1983) approximations, for cross-checks: Rx ≤ Ry (m), E′ = 2E*. */
export function hamrockBrewe(Rx: number, Ry: number, Estar: number, W: number) {
  const alpha = Ry / Rx;
  const k = Math.pow(alpha, 2 / Math.PI);
  const Ebar = 1 + (Math.PI / 2 - 1) / alpha;
  const Fbar = Math.PI / 2 + (Math.PI / 2 - 1) * Math.log(alpha);
  const R = 1 / (1 / Rx + 1 / Ry);
  const Ep = 2 * Estar;
  const a = Math.cbrt((6 * k * k * Ebar * W * R) / (Math.PI * Ep));
  const b = Math.cbrt((6 * Ebar * W * R) / (Math.PI * k * Ep));
  const delta = Fbar * Math.cbrt((9 / (2 * Ebar * R)) * Math.pow(W / (Math.PI * k * Ep), 2));
  return { k, a, b, p0: (3 * W) / (2 * Math.PI * a * b), delta };
}
