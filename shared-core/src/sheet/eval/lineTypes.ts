/**
 * Line types as table entries: each names its keys and builds an engine LineModel from evaluated
 * values (and its substrate, when it needs one). Adding a line type means adding an entry here.
 * Builders throw RangeError for impossible geometry; the caller reports it as a `range` diagnostic.
 */
import {
  coaxLossyLine, coaxNotes, coaxZ0, idealLine, microstripAt, microstripLossyLine, microstripStatic, microstripWidthForZ0, openEndExtension,
  sigmaCopperAnnealed, type LossyLineModel,
  coplanarAirImpedanceSlope, coplanarConductorNotes, coplanarConductorResistanceModel, coplanarLine, coplanarStatic, coplanarWidthForZ0, striplineLine, striplineStatic, striplineWidthForZ0,
  wheelerAirImpedanceSlope, wheelerResistance, withConductorLoss,
  type LineModel, type ValidityNote,
} from '../../engine/index.js';
import type { KeySpec, KeyTable } from '../schema.js';
import { si, tol, type ItemValues } from './items.js';

export interface SubstrateValue {
  dk: number;
  dkTol: number;
  df: number;
  heightM: number;
  heightTol: number;
  copperM: number;
  conductivity: number;
  roughnessM: number;
}

export interface LineBuild {
  model: LineModel;
  /** The same line with its loss split into conductor and dielectric parts, where modelled. */
  lossy?: LossyLineModel;
  /** Why conductor loss is not included, when it is not. */
  lossNote?: string;
  /** Models used, for hovers and reports. */
  modelName: string;
  /** Static (or dispersion-free) Z0 and εeff. */
  z0: number;
  epsEff: number;
  widthM: number | null;
  /** A width the sheet asked to synthesize. */
  synthesizedWidthM: number | null;
  /** Validity notes for use at frequency f (static notes included). */
  notes(frequencyHz: number): ValidityNote[];
  /** Line models at every corner of the given tolerances (empty when there are none). */
  corners(): LineModel[];
  /** Open-end length extension, where the line type has a published model for it. */
  openEnd?: () => { extensionM: number; model: string; notes: ValidityNote[] };
  /** Length of a via from the strip to ground, where the line sits on a board. */
  viaHeightM?: number;
}

export interface LineTypeSpec {
  keys: KeyTable;
  needsSubstrate: boolean;
  build(values: ItemValues, substrate: SubstrateValue | null): LineBuild;
}

const AT: KeySpec = { value: { type: 'quantity', quantity: 'frequency' }, doc: 'frequency for dispersion, wavelength and loss' };
const DF: KeySpec = { value: { type: 'quantity', quantity: 'dimensionless' }, doc: 'loss tangent of the fill' };

/** Every combination of nominal ± tolerance for the toleranced parameters (2^k corners). */
export function toleranceCorners(params: { nominal: number; tol: number }[]): number[][] {
  const varying = params.map((p) => (p.tol > 0 ? [p.nominal - p.tol, p.nominal + p.tol] : [p.nominal]));
  if (varying.every((v) => v.length === 1)) return [];
  return varying.reduce<number[][]>((acc, options) => acc.flatMap((c) => options.map((o) => [...c, o])), [[]]);
}

/** Line models at every corner of the board's dk and height tolerances and the width's. */
function boardCorners(s: SubstrateValue, widthM: number, widthTol: number, make: (dk: number, h: number, w: number) => LineModel): LineModel[] {
  return toleranceCorners([
    { nominal: s.dk, tol: s.dkTol },
    { nominal: s.heightM, tol: s.heightTol },
    { nominal: widthM, tol: widthTol },
  ]).map(([dk, h, w]) => make(dk!, h!, w!));
}

const microstrip: LineTypeSpec = {
  needsSubstrate: true,
  keys: {
    keys: {
      width: { value: { type: 'quantity', quantity: 'length', tolerance: true }, doc: 'strip width (analysis)' },
      z0: { value: { type: 'quantity', quantity: 'impedance' }, doc: 'target impedance: the width is synthesized' },
      at: AT,
    },
    required: [['width', 'z0']],
    exclusive: [['width', 'z0']],
  },
  build(values, sub) {
    const s = sub!;
    const thicknessM = s.copperM;
    const target = si(values, 'z0');
    const widthM = target !== undefined
      ? microstripWidthForZ0({ z0: target, heightM: s.heightM, dk: s.dk, thicknessM }).widthM
      : si(values, 'width')!;
    const geometry = { widthM, heightM: s.heightM, dk: s.dk, thicknessM };
    const stat = microstripStatic(geometry);
    const conductor = thicknessM > 0 ? { conductivity: s.conductivity, roughnessM: s.roughnessM } : {};
    const lossy = microstripLossyLine({ ...geometry, df: s.df, ...conductor });
    return {
      model: lossy,
      lossy,
      lossNote: thicknessM > 0 ? undefined : 'conductor loss needs the copper thickness: add "copper 35 um" (or "copper 1 oz") to the substrate',
      modelName: `microstrip: Hammerstad–Jensen 1980 (Z0, εeff, strip thickness), Kirschning–Jansen 1982 (εeff(f)), Jansen–Kirschning 1983 (Z0(f)); ${thicknessM > 0 ? 'conductor loss by Wheeler\'s incremental-inductance rule with Hammerstad–Bekkadal roughness, dielectric loss from Df' : 'dielectric loss only'}`,
      z0: stat.z0,
      epsEff: stat.epsEff,
      widthM,
      synthesizedWidthM: target !== undefined ? widthM : null,
      notes: (f) => (f > 0 ? microstripAt(geometry, f).notes : stat.notes),
      corners: () => boardCorners(s, widthM, tol(values, 'width'), (dk, h, w) => microstripLossyLine({ widthM: w, heightM: h, dk, thicknessM, df: s.df, ...conductor })),
      openEnd: () => openEndExtension(geometry),
      viaHeightM: s.heightM,
    };
  },
};

const ideal: LineTypeSpec = {
  needsSubstrate: false,
  keys: {
    keys: {
      z0: { value: { type: 'quantity', quantity: 'impedance' }, doc: 'characteristic impedance' },
      dk: { value: { type: 'quantity', quantity: 'dimensionless', tolerance: true }, doc: 'effective permittivity of the line', aliases: ['er'] },
      velocity: { value: { type: 'quantity', quantity: 'dimensionless' }, doc: 'velocity factor v/c (0 … 1]' },
      df: DF,
      at: AT,
    },
    required: [['z0']],
    exclusive: [['dk', 'velocity']],
  },
  build(values) {
    const z0 = si(values, 'z0')!;
    const df = si(values, 'df') ?? 0;
    const velocityFactor = si(values, 'velocity');
    const dk = si(values, 'dk');
    const model = idealLine({ z0, epsEff: dk, velocityFactor, df });
    return {
      model,
      modelName: 'ideal TEM line (no dispersion)',
      z0,
      epsEff: model(0).epsEff,
      widthM: null,
      synthesizedWidthM: null,
      notes: () => [],
      corners: () => toleranceCorners([{ nominal: dk ?? 1, tol: tol(values, 'dk') }]).map(([e]) => idealLine({ z0, epsEff: e, df })),
    };
  },
};

const coax: LineTypeSpec = {
  needsSubstrate: false,
  keys: {
    keys: {
      inner: { value: { type: 'quantity', quantity: 'length' }, doc: 'outer diameter of the inner conductor' },
      conductivity: { value: { type: 'quantity', quantity: 'conductivity' }, doc: 'conductor conductivity (default annealed copper, 5.8e7 S/m)' },
      outer: { value: { type: 'quantity', quantity: 'length' }, doc: 'inner diameter of the outer conductor' },
      dk: { value: { type: 'quantity', quantity: 'dimensionless', tolerance: true }, doc: 'relative permittivity of the fill (1 for air)', aliases: ['er'] },
      df: DF,
      at: AT,
    },
    required: [['inner'], ['outer']],
    exclusive: [],
  },
  build(values) {
    const spec = {
      innerDiameterM: si(values, 'inner')!, outerDiameterM: si(values, 'outer')!, dk: si(values, 'dk') ?? 1, df: si(values, 'df') ?? 0,
      conductivity: si(values, 'conductivity') ?? sigmaCopperAnnealed,
    };
    const lossy = coaxLossyLine(spec);
    return {
      model: lossy,
      lossy,
      modelName: 'coaxial line (exact TEM; exact conductor loss for smooth round conductors, dielectric loss from Df)',
      z0: coaxZ0(spec.innerDiameterM, spec.outerDiameterM, spec.dk),
      epsEff: spec.dk,
      widthM: null,
      synthesizedWidthM: null,
      notes: (f) => coaxNotes(spec, f),
      corners: () => toleranceCorners([{ nominal: spec.dk, tol: tol(values, 'dk') }]).map(([dk]) => coaxLossyLine({ ...spec, dk: dk! })),
    };
  },
};

const WIDTH_OR_Z0 = {
  width: { value: { type: 'quantity', quantity: 'length', tolerance: true }, doc: 'strip width (analysis)' },
  z0: { value: { type: 'quantity', quantity: 'impedance' }, doc: 'target impedance: the width is synthesized' },
} as const satisfies Record<string, KeySpec>;

/**
 * Symmetric stripline: `height` of the substrate is the ground-to-ground spacing b. Conductor loss
 * by Wheeler's incremental-inductance rule on the same static model (needs the copper thickness).
 */
const stripline: LineTypeSpec = {
  needsSubstrate: true,
  keys: { keys: { ...WIDTH_OR_Z0, at: AT }, required: [['width', 'z0']], exclusive: [['width', 'z0']] },
  build(values, sub) {
    const s = sub!;
    const t = s.copperM;
    const target = si(values, 'z0');
    const widthM = target !== undefined ? striplineWidthForZ0({ z0: target, heightM: s.heightM, dk: s.dk, thicknessM: t }).widthM : si(values, 'width')!;
    const geometry = { widthM, heightM: s.heightM, dk: s.dk, thicknessM: t };
    const stat = striplineStatic(geometry);
    const make = (g: typeof geometry): LossyLineModel => {
      const base = striplineLine({ ...g, df: s.df });
      if (!(t > 0)) return withConductorLoss(base, () => 0);
      const z0 = striplineStatic(g).z0;
      const slope = wheelerAirImpedanceSlope((n) => striplineStatic({ widthM: g.widthM - 2 * n, heightM: g.heightM + 2 * n, dk: 1, thicknessM: t - 2 * n }).z0, 0.005 * Math.min(g.widthM, t));
      return withConductorLoss(base, (f) => (f > 0 ? wheelerResistance(slope, f, { conductivity: s.conductivity, roughnessM: s.roughnessM }) / (2 * z0) : 0));
    };
    const lossy = make(geometry);
    return {
      model: lossy,
      lossy,
      lossNote: t > 0 ? undefined : 'conductor loss needs the copper thickness: add "copper 35 um" (or "copper 1 oz") to the substrate',
      modelName: `stripline: Cohn 1954 (exact, zero thickness) with Wheeler 1978 thickness correction; ${t > 0 ? 'conductor loss by Wheeler\'s incremental-inductance rule, ' : ''}dielectric loss from Df; no dispersion (TEM)`,
      z0: stat.z0,
      epsEff: stat.epsEff,
      widthM,
      synthesizedWidthM: target !== undefined ? widthM : null,
      notes: () => stat.notes,
      corners: () => boardCorners(s, widthM, tol(values, 'width'), (dk, h, w) => make({ widthM: w, heightM: h, dk, thicknessM: t })),
      viaHeightM: s.heightM / 2,
    };
  },
};

/** Coplanar waveguide on a substrate (`cpw`), or conductor-backed (`gcpw`): `width` (or `z0`) and `gap`. */
function coplanar(grounded: boolean): LineTypeSpec {
  return {
    needsSubstrate: true,
    keys: {
      keys: { ...WIDTH_OR_Z0, gap: { value: { type: 'quantity', quantity: 'length' }, doc: 'slot width between the strip and the side grounds' }, at: AT },
      required: [['width', 'z0'], ['gap']],
      exclusive: [['width', 'z0']],
    },
    build(values, sub) {
      const s = sub!;
      const gapM = si(values, 'gap')!;
      const target = si(values, 'z0');
      const base = { gapM, heightM: s.heightM, dk: s.dk, thicknessM: s.copperM, grounded };
      const widthM = target !== undefined ? coplanarWidthForZ0({ ...base, z0: target }).widthM : si(values, 'width')!;
      const geometry = { ...base, widthM };
      const stat = coplanarStatic(geometry);
      const t = s.copperM;
      const conductor = { conductivity: s.conductivity, roughnessM: s.roughnessM };
      // Conductor loss (Owyang–Wu) needs t > 0 and t small against the strip and slots.
      let lossNote: string | undefined;
      if (!(t > 0)) lossNote = 'conductor loss needs the copper thickness: add "copper 35 um" (or "copper 1 oz") to the substrate';
      else {
        try {
          coplanarAirImpedanceSlope({ widthM, gapM, thicknessM: t });
        } catch (e) {
          if (!(e instanceof RangeError)) throw e;
          lossNote = `conductor loss is not included: ${e.message}`;
        }
      }
      const withLoss = lossNote === undefined;
      const make = (g: typeof geometry): LossyLineModel => {
        const line = coplanarLine({ ...g, df: s.df });
        if (!withLoss) return withConductorLoss(line, () => 0);
        const z0 = coplanarStatic(g).z0;
        let resistance: (f: number) => number;
        try {
          resistance = coplanarConductorResistanceModel({ widthM: g.widthM, gapM: g.gapM, thicknessM: t }, conductor);
        } catch (e) {
          if (!(e instanceof RangeError)) throw e;
          return withConductorLoss(line, () => 0); // a tolerance corner beyond the formula: the nominal line reports it
        }
        return withConductorLoss(line, (f) => resistance(f) / (2 * z0));
      };
      const lossy = make(geometry);
      return {
        model: lossy,
        lossy,
        lossNote,
        modelName: `${grounded ? 'grounded coplanar waveguide' : 'coplanar waveguide'}: conformal mapping (Wen 1969; finite substrate${grounded ? ' and lower ground' : ''} after Ghione–Naldi) with a slot-wall thickness estimate; ${withLoss ? `conductor loss by Owyang–Wu 1958 (Wheeler's rule on the conformal map; ${grounded ? 'within a few % of a field solution where h ≥ (s + 2g)/2, high below' : 'about 5–11 % low against a field solution'}) with Hammerstad–Bekkadal roughness, ` : ''}dielectric loss from Df; no dispersion (quasi-static)`,
        z0: stat.z0,
        epsEff: stat.epsEff,
        widthM,
        synthesizedWidthM: target !== undefined ? widthM : null,
        notes: (f) => (withLoss ? [...stat.notes, ...coplanarConductorNotes({ widthM, gapM, thicknessM: t, heightM: s.heightM, grounded }, f, conductor)] : stat.notes),
        corners: () => boardCorners(s, widthM, tol(values, 'width'), (dk, h, w) => make({ ...geometry, widthM: w, heightM: h, dk })),
        viaHeightM: s.heightM,
      };
    },
  };
}

/** The line-type table. */
export const LINE_TYPES: Record<string, LineTypeSpec> = { microstrip, stripline, cpw: coplanar(false), gcpw: coplanar(true), ideal, coax };
