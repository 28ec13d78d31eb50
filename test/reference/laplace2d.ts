/**
 * Reference 2-D quasi-static Laplace solver for strip conductors (tests only).
 *
 * An independent numerical method used to check closed-form line models. It computes the
 * per-unit-length capacitance of one strip (potential 1) above a ground plane y = 0, inside a
 * rectangular box, with a dielectric slab filling dielectricBottom ≤ y ≤ dielectricTop:
 *
 *   ∇·(ε ∇φ) = 0,  φ = 1 on the strip, φ = 0 on the ground plane, the top wall, (optionally)
 *   the side wall and (optionally) coplanar grounds beside the strip; ∂φ/∂x = 0 on the symmetry
 *   plane x = 0 through the strip centre (half domain).
 *
 * The strip is of zero thickness unless `thickness` is given (then a rectangle of conductor
 * nodes); coplanar grounds, when given, have the strip's thickness and run from `coplanarGroundX`
 * to the side wall. Without these options the grid and the results are those of the original
 * zero-thickness solver, bit for bit.
 *
 * Discretisation (finite volume, vertex centred, 5-point):
 * - Tensor-product non-uniform grid (see {@link buildAxis}): spacing proportional to the distance
 *   from the strip-edge lines (geometric grading, ratio 1 + κ), capped at sNear inside the core
 *   region and growing geometrically again (ratio 1 + κ) beyond it, so walls far away are cheap.
 *   The strip, the strip edge, the dielectric interface and the walls are grid lines.
 * - The permittivity is constant on each grid cell; the flux through a control-volume face uses the
 *   permittivities of the two cells that share the face, weighted by their lengths along the face
 *   (face averaging). Across an interface normal to the field this gives the exact series result.
 * - The scheme equals linear finite elements on the triangulated grid, so the discrete energy is a
 *   Dirichlet-principle upper bound: the computed C converges to the exact value from above.
 *
 * Solver: conjugate gradients on the symmetric positive-definite system, preconditioned with
 * modified incomplete Cholesky MIC(0) (natural ordering, relaxation 0.97); stopped when
 * ‖r‖₂ ≤ 1e-9·‖b‖₂.
 *
 * Capacitance from the stored energy, W = ½CV² (V = 1): C = 2·ε0·Σ_faces c_f·(Δφ)², the factor 2
 * restoring the mirrored half. The charge on the strip from Gauss's law (the discrete flux out of
 * the strip nodes) is also returned; at convergence the two agree to the solver tolerance.
 *
 * Capacitance per unit length depends only on the shape, so lengths may be given in any unit.
 */

/** Vacuum permittivity ε0, F/m (CODATA 2018). Kept apart from the engine on purpose. */
export const EPS0 = 8.8541878128e-12;
/** Speed of light in vacuum, m/s (exact, SI). */
export const C0 = 299_792_458;

/** Cross-section to solve. All lengths in one (any) unit; the strip is centred on x = 0. */
export interface CrossSection {
  /** Half the strip width. */
  halfWidth: number;
  /** Height of the strip's lower face above the ground plane y = 0 (> 0). */
  stripY: number;
  /** Strip thickness (default 0): the strip fills stripY ≤ y ≤ stripY + thickness. */
  thickness?: number;
  /**
   * Coplanar ground conductors (default none): φ = 0 for x ≥ coplanarGroundX (> halfWidth) over
   * the strip's y range, out to the side wall.
   */
  coplanarGroundX?: number;
  /** The dielectric fills dielectricBottom ≤ y ≤ dielectricTop across the whole box (top 0 for none). */
  dielectricTop: number;
  /** Lower face of the dielectric slab (default 0, on the ground plane). */
  dielectricBottom?: number;
  /**
   * Length unit of the grid grading (default stripY): sNear and d0 of {@link GridParams} are
   * multiples of it, and the core region reaches this far beyond the conductor edges.
   */
  gridLength?: number;
  /** Relative permittivity of the dielectric. */
  epsR: number;
  /** Height of the top wall, always at ground potential. */
  boxTop: number;
  /** Distance of the side wall from the symmetry plane. */
  boxHalfWidth: number;
  /** Side wall: 'ground' (φ = 0) or 'open' (magnetic wall, ∂φ/∂n = 0). */
  sideWall: 'ground' | 'open';
}

/** Grid grading parameters for refinement level 0; level ℓ divides κ and sNear by 2^ℓ, d0 by 4^ℓ. */
export interface GridParams {
  /** Spacing / distance-from-edge ratio near the strip edge (geometric grading ratio 1 + κ). */
  kappa: number;
  /** Largest spacing inside the core region, in units of the grid length (default the strip height). */
  sNear: number;
  /** Smallest spacing at the strip edge, in units of the grid length (default the strip height). */
  d0: number;
}

/** Default level-0 grading (checked against a third level, see the test header). */
export const DEFAULT_GRID: GridParams = { kappa: 0.3, sNear: 0.25, d0: 0.01 };

/** Specification of one axis for {@link buildAxis}. */
export interface AxisSpec {
  /** Coordinates that must be nodes (any order, duplicates allowed); min and max are the ends. */
  keyPoints: number[];
  /** Lines on which the field is singular (strip edges): spacing grows ∝ distance from them. */
  singular: number[];
  /** Core region [lo, hi]: spacing ≤ sNear inside, growing geometrically outside. */
  coreLo: number;
  coreHi: number;
  kappa: number;
  sNear: number;
  d0: number;
}

/**
 * Build a graded 1-D grid. Local target spacing
 *   s(x) = max(d0, min(κ·d_sing(x), sNear + κ·d_out(x))),
 * d_sing = distance to the nearest singular line, d_out = distance outside the core region.
 * Between consecutive key points the nodes are equally spaced in the stretched coordinate
 * ξ(x) = ∫ dx/s(x) (integrated numerically), so halving κ, sNear and d0 roughly doubles every count.
 * @returns ascending node coordinates including every key point.
 */
export function buildAxis(spec: AxisSpec): Float64Array {
  const keys = [...new Set(spec.keyPoints)].sort((p, q) => p - q);
  const spacing = (x: number): number => {
    let dSing = Infinity;
    for (const s of spec.singular) dSing = Math.min(dSing, Math.abs(x - s));
    const dOut = Math.max(0, spec.coreLo - x, x - spec.coreHi);
    return Math.max(spec.d0, Math.min(spec.kappa * dSing, spec.sNear + spec.kappa * dOut));
  };
  const nodes: number[] = [keys[0]!];
  for (let s = 0; s + 1 < keys.length; s++) {
    const p = keys[s]!;
    const q = keys[s + 1]!;
    // March with sub-steps of 1/16 of the local spacing, tabulating ξ(x) by the trapezoid rule.
    const xs = [p];
    const xis = [0];
    let x = p;
    let inv = 1 / spacing(p);
    while (x < q) {
      const xn = Math.min(q, x + spacing(x) / 16);
      const invn = 1 / spacing(xn);
      xis.push(xis[xis.length - 1]! + 0.5 * (xn - x) * (inv + invn));
      xs.push(xn);
      x = xn;
      inv = invn;
    }
    const total = xis[xis.length - 1]!;
    const n = Math.max(1, Math.ceil(total - 1e-9));
    let m = 0;
    for (let k = 1; k < n; k++) {
      const target = (k * total) / n;
      while (xis[m + 1]! < target) m++;
      const t = (target - xis[m]!) / (xis[m + 1]! - xis[m]!);
      nodes.push(xs[m]! + t * (xs[m + 1]! - xs[m]!));
    }
    nodes.push(q);
  }
  return Float64Array.from(nodes);
}

/** Outcome of one solve. */
export interface SolveResult {
  /** Capacitance per unit length of the full (mirrored) cross-section from the energy, F/m. */
  capacitance: number;
  /** Same, from the charge on the strip (Gauss's law on the discrete flux), F/m. */
  capacitanceGauss: number;
  /** Grid size (nodes along x, along y). */
  nx: number;
  ny: number;
  /** Conjugate-gradient iterations used. */
  iterations: number;
}

/** Index of a coordinate known to be a node (exact key point). */
function nodeIndex(axis: Float64Array, value: number): number {
  const i = axis.indexOf(value);
  if (i < 0) throw new Error(`grid is missing the key coordinate ${value}`);
  return i;
}

/**
 * Solve the cross-section on the grid of refinement level `level` and return its capacitance.
 * @param geometry the cross-section (see {@link CrossSection}).
 * @param level refinement level ≥ 0 (each level halves the spacings).
 * @param grid level-0 grading; lengths in it are relative to `geometry.stripY`.
 */
export function solveCrossSection(
  geometry: CrossSection,
  level: number,
  grid: GridParams = DEFAULT_GRID,
): SolveResult {
  const { halfWidth: a, stripY: hs, dielectricTop, epsR, boxTop, boxHalfWidth, sideWall } = geometry;
  const t = geometry.thickness ?? 0;
  const gx = geometry.coplanarGroundX;
  const dielectricBottom = geometry.dielectricBottom ?? 0;
  const len = geometry.gridLength ?? hs;
  if (!(t >= 0 && hs + t < boxTop)) throw new Error('the strip must lie below the top wall');
  if (gx !== undefined && !(gx > a && gx < boxHalfWidth)) throw new Error('coplanar grounds must start between the strip edge and the side wall');
  const f = 2 ** -level;
  const common = { kappa: grid.kappa * f, sNear: grid.sNear * len * f, d0: grid.d0 * len * f * f };
  const xs = buildAxis({
    keyPoints: [0, a, boxHalfWidth, ...(gx !== undefined ? [gx] : [])],
    singular: [...(a < boxHalfWidth ? [a] : []), ...(gx !== undefined ? [gx] : [])],
    coreLo: 0,
    coreHi: (gx ?? a) + len,
    ...common,
  });
  const ys = buildAxis({
    keyPoints: [
      0,
      hs,
      boxTop,
      ...(dielectricTop > 0 ? [dielectricTop] : []),
      ...(t > 0 ? [hs + t] : []),
      ...(dielectricBottom > 0 ? [dielectricBottom] : []),
    ],
    singular: a < boxHalfWidth ? (t > 0 ? [hs, hs + t] : [hs]) : [],
    coreLo: Math.max(0, hs - len),
    coreHi: hs + t + len,
    ...common,
  });
  const nx = xs.length;
  const ny = ys.length;
  const n = nx * ny;
  const iEdge = nodeIndex(xs, a);
  const iGround = gx !== undefined ? nodeIndex(xs, gx) : nx;
  const jStrip = nodeIndex(ys, hs);
  const jTop = t > 0 ? nodeIndex(ys, hs + t) : jStrip;

  // Face couplings: cE[k] between nodes k and k+1, cN[k] between k and k+nx (zero past the ends).
  const cellEps = (j: number): number => (ys[j]! >= dielectricBottom && ys[j + 1]! <= dielectricTop ? epsR : 1);
  const cE = new Float64Array(n);
  const cN = new Float64Array(n);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      if (i < nx - 1) {
        const dx = xs[i + 1]! - xs[i]!;
        const below = j > 0 ? cellEps(j - 1) * (ys[j]! - ys[j - 1]!) : 0;
        const above = j < ny - 1 ? cellEps(j) * (ys[j + 1]! - ys[j]!) : 0;
        cE[k] = (below + above) / (2 * dx);
      }
      if (j < ny - 1) {
        const dy = ys[j + 1]! - ys[j]!;
        const left = i > 0 ? xs[i]! - xs[i - 1]! : 0;
        const right = i < nx - 1 ? xs[i + 1]! - xs[i]! : 0;
        cN[k] = (cellEps(j) * (left + right)) / (2 * dy);
      }
    }
  }

  // Fixed nodes: ground plane, top wall, side wall if grounded, coplanar grounds, and the strip (φ = 1).
  const fixedValue = new Float64Array(n);
  const free = new Uint8Array(n).fill(1);
  for (let i = 0; i < nx; i++) {
    free[i] = 0;
    free[(ny - 1) * nx + i] = 0;
  }
  if (sideWall === 'ground') for (let j = 0; j < ny; j++) free[j * nx + nx - 1] = 0;
  for (let j = jStrip; j <= jTop; j++) {
    for (let i = 0; i <= iEdge; i++) {
      free[j * nx + i] = 0;
      fixedValue[j * nx + i] = 1;
    }
    for (let i = iGround; i < nx; i++) free[j * nx + i] = 0;
  }

  // System A·φ = b over the free nodes; aE/aN keep only free–free couplings.
  const freeList: number[] = [];
  for (let k = 0; k < n; k++) if (free[k]) freeList.push(k);
  const idx = Int32Array.from(freeList);
  const diag = new Float64Array(n);
  const rhs = new Float64Array(n);
  const aE = new Float64Array(n);
  const aN = new Float64Array(n);
  for (const k of idx) {
    // Neighbours east, west, north, south with their face couplings.
    for (let e = 0; e < 4; e++) {
      const m = e === 0 ? k + 1 : e === 1 ? k - 1 : e === 2 ? k + nx : k - nx;
      const c = e === 0 ? cE[k]! : e === 1 ? cE[k - 1]! : e === 2 ? cN[k]! : cN[k - nx]!;
      if (c === 0) continue;
      diag[k]! += c;
      if (!free[m]) rhs[k]! += c * fixedValue[m]!;
    }
    if (free[k + 1] && cE[k]! > 0) aE[k] = cE[k]!;
    if (free[k + nx]) aN[k] = cN[k]!;
  }

  const phi = new Float64Array(fixedValue);
  const iterations = pcgSolve(idx, nx, diag, aE, aN, rhs, phi);

  // Energy: Σ c·(Δφ)² over all faces (fixed nodes included).
  let energy = 0;
  for (let k = 0; k < n; k++) {
    if (cE[k]! > 0) energy += cE[k]! * (phi[k + 1]! - phi[k]!) ** 2;
    if (cN[k]! > 0) energy += cN[k]! * (phi[k + nx]! - phi[k]!) ** 2;
  }
  // Gauss: net flux out of the strip nodes (faces between two strip nodes carry none).
  let charge = 0;
  for (let j = jStrip; j <= jTop; j++) {
    for (let i = 0; i <= iEdge; i++) {
      const k = j * nx + i;
      charge += cE[k]! * (1 - phi[k + 1]!) + cN[k]! * (1 - phi[k + nx]!) + cN[k - nx]! * (1 - phi[k - nx]!);
      if (i > 0) charge += cE[k - 1]! * (1 - phi[k - 1]!);
    }
  }
  return { capacitance: 2 * EPS0 * energy, capacitanceGauss: 2 * EPS0 * charge, nx, ny, iterations };
}

/**
 * Preconditioned conjugate gradients with MIC(0) for the 5-point system held as diagonal plus
 * east/north free–free couplings (A_k,k+1 = −aE[k], A_k,k+nx = −aN[k]). Solves in place into
 * `x` (whose free entries start at 0). Stops at ‖r‖₂ ≤ 1e-9·‖b‖₂.
 * @returns the number of iterations.
 */
function pcgSolve(
  idx: Int32Array,
  nx: number,
  diag: Float64Array,
  aE: Float64Array,
  aN: Float64Array,
  b: Float64Array,
  x: Float64Array,
): number {
  const n = diag.length;
  const omega = 0.97;
  // MIC(0): d_k = a_kk − aW(aW + ω·aN_W)/d_W − aS(aS + ω·aE_S)/d_S, natural ordering.
  const invD = new Float64Array(n);
  for (const k of idx) {
    const aW = aE[k - 1]!;
    const aS = aN[k - nx]!;
    let v = diag[k]!;
    if (aW > 0) v -= aW * (aW + omega * aN[k - 1]!) * invD[k - 1]!;
    if (aS > 0) v -= aS * (aS + omega * aE[k - nx]!) * invD[k - nx]!;
    invD[k] = 1 / v;
  }
  const r = new Float64Array(n);
  const z = new Float64Array(n);
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  const m = idx.length;
  /** z = M⁻¹r by forward and backward substitution; returns r·z. */
  const precondition = (): number => {
    for (let t = 0; t < m; t++) {
      const k = idx[t]!;
      z[k] = (r[k]! + aE[k - 1]! * z[k - 1]! + aN[k - nx]! * z[k - nx]!) * invD[k]!;
    }
    let rz = 0;
    for (let t = m - 1; t >= 0; t--) {
      const k = idx[t]!;
      const v = z[k]! + (aE[k]! * z[k + 1]! + aN[k]! * z[k + nx]!) * invD[k]!;
      z[k] = v;
      rz += r[k]! * v;
    }
    return rz;
  };
  let bNorm2 = 0;
  for (let t = 0; t < m; t++) {
    const k = idx[t]!;
    r[k] = b[k]!;
    bNorm2 += b[k]! * b[k]!;
  }
  const tol2 = 1e-18 * bNorm2;
  let rz = precondition();
  for (let t = 0; t < m; t++) p[idx[t]!] = z[idx[t]!]!;
  for (let it = 1; it <= 20_000; it++) {
    let pq = 0;
    for (let t = 0; t < m; t++) {
      const k = idx[t]!;
      const v =
        diag[k]! * p[k]! -
        aE[k]! * p[k + 1]! -
        aE[k - 1]! * p[k - 1]! -
        aN[k]! * p[k + nx]! -
        aN[k - nx]! * p[k - nx]!;
      q[k] = v;
      pq += p[k]! * v;
    }
    const alpha = rz / pq;
    let rr = 0;
    for (let t = 0; t < m; t++) {
      const k = idx[t]!;
      x[k]! += alpha * p[k]!;
      const v = r[k]! - alpha * q[k]!;
      r[k] = v;
      rr += v * v;
    }
    if (rr <= tol2) return it;
    const rzNew = precondition();
    const beta = rzNew / rz;
    rz = rzNew;
    for (let t = 0; t < m; t++) {
      const k = idx[t]!;
      p[k] = z[k]! + beta * p[k]!;
    }
  }
  throw new Error('conjugate gradients did not converge in 20 000 iterations');
}

/** Capacitance from two grid levels with Richardson extrapolation. */
export interface ExtrapolatedCapacitance {
  /** Solve on level ℓ and on level ℓ + 1 (all spacings halved). */
  coarse: SolveResult;
  fine: SolveResult;
  /** Richardson value for a second-order scheme, C∞ ≈ C_fine + (C_fine − C_coarse)/3, F/m. */
  value: number;
}

/**
 * Solve on levels `coarseLevel` and `coarseLevel + 1` and extrapolate to zero spacing, assuming
 * the second-order convergence that the graded grid restores (checked on three grids in the test).
 * |value − fine.capacitance| is the Richardson estimate of the fine grid's own error.
 */
export function extrapolatedCapacitance(
  geometry: CrossSection,
  coarseLevel = 1,
  grid: GridParams = DEFAULT_GRID,
): ExtrapolatedCapacitance {
  const coarse = solveCrossSection(geometry, coarseLevel, grid);
  const fine = solveCrossSection(geometry, coarseLevel + 1, grid);
  return { coarse, fine, value: fine.capacitance + (fine.capacitance - coarse.capacitance) / 3 };
}

/**
 * Microstrip cross-section normalised to h = 1: strip of width w/h on a substrate of relative
 * permittivity `epsR` filling 0 ≤ y ≤ 1 across the box; box walls (grounded) at
 * `boxFactor`·(h + w) from the strip centre, sideways and upwards.
 */
export function microstripSection(wOverH: number, epsR: number, boxFactor = 200): CrossSection {
  const far = boxFactor * (1 + wOverH);
  return {
    halfWidth: wOverH / 2,
    stripY: 1,
    dielectricTop: 1,
    epsR,
    boxTop: far,
    boxHalfWidth: far,
    sideWall: 'ground',
  };
}

/**
 * Symmetric stripline cross-section normalised to a ground-plane spacing b = 2: strip of width
 * w/b midway (centred on y = 1) between grounds at y = 0 and y = 2, vacuum throughout, side wall
 * (magnetic) 10·b beyond the strip edge, where the field has decayed by about exp(−10π).
 * With `tOverB` > 0 the strip is t thick, from y = 1 − t/b to y = 1 + t/b.
 */
export function striplineSection(wOverB: number, tOverB = 0): CrossSection {
  return {
    halfWidth: wOverB,
    stripY: 1 - tOverB,
    ...(tOverB > 0 ? { thickness: 2 * tOverB } : {}),
    dielectricTop: 0,
    epsR: 1,
    boxTop: 2,
    boxHalfWidth: wOverB + 20,
    sideWall: 'open',
  };
}

/** Coplanar waveguide geometry for {@link coplanarSection}, normalised to the substrate height h. */
export interface CoplanarSpec {
  /** Centre strip width s/h. */
  sOverH: number;
  /** Slot width g/h on each side. */
  gOverH: number;
  epsR: number;
  /** Metal thickness t/h (default 0), strip and coplanar grounds alike, on top of the substrate. */
  tOverH?: number;
  /** true: conductor-backed (ground plane right under the substrate); false: substrate in free space. */
  grounded: boolean;
  /** Box walls this many (s + 2g + h) away from the slots (default 50). */
  boxFactor?: number;
}

/**
 * Coplanar waveguide cross-section in units of h = 1: centre strip on top of a substrate slab of
 * height 1, coplanar grounds from x = s/2 + g out to a grounded side wall. Conductor-backed: the
 * slab sits on the ground plane y = 0. Without backing: the slab floats with its lower face
 * `far` above the box floor, `far` = boxFactor·(s + 2g + 1), so the floor stands in for infinity.
 */
export function coplanarSection(spec: CoplanarSpec): CrossSection {
  const { sOverH: s, gOverH: g, epsR, grounded } = spec;
  const t = spec.tOverH ?? 0;
  const far = (spec.boxFactor ?? 50) * (s + 2 * g + 1);
  const bottom = grounded ? 0 : far;
  return {
    halfWidth: s / 2,
    stripY: bottom + 1,
    ...(t > 0 ? { thickness: t } : {}),
    coplanarGroundX: s / 2 + g,
    dielectricTop: bottom + 1,
    ...(grounded ? {} : { dielectricBottom: bottom }),
    gridLength: Math.min(1, s + 2 * g),
    epsR,
    boxTop: bottom + 1 + t + far,
    boxHalfWidth: s / 2 + g + far,
    sideWall: 'ground',
  };
}

/**
 * Quasi-TEM line parameters from the capacitance with the dielectric (C) and in vacuum (C0):
 * Z0 = 1/(c0·√(C·C0)), εeff = C/C0.
 */
export function lineFromCapacitances(c: number, cAir: number): { z0: number; epsEff: number } {
  return { z0: 1 / (C0 * Math.sqrt(c * cAir)), epsEff: c / cAir };
}
