/*
 * The generic machinery: validate a request against a definition, convert inputs to SI, run
 * compute, convert the outputs. Never throws for bad input: every refusal is a FieldError.
 */
import type { CalculatorDefinition, ComputeContext, InputSpec } from './define';
import { outputSIUnit } from './define';
import { lines, listLinesTex, num, qty, unitTex, wrapLines } from './latex';
import { type Given, isRecord, kindName, readInput, unitList } from './read-input';
import type {
  Bound,
  CalculationOutcome,
  CalculationRequest,
  FieldError,
  QuantityKind,
  QuantityOut,
  Step,
} from './types';
import { dimensionsOf, fromSI, type LinearUnit, parseUnit, SI_UNIT, toSI } from './units';

interface CompiledInput {
  name: string;
  spec: InputSpec;
  minSI?: number;
  maxSI?: number;
  defaultValue?: number | string | readonly number[];
}

class Refusal extends Error {
  constructor(readonly field: string, message: string) {
    super(message);
  }
}

const compiledCache = new WeakMap<CalculatorDefinition, CompiledInput[]>();

function compile(def: CalculatorDefinition): CompiledInput[] {
  let compiled = compiledCache.get(def);
  if (compiled !== undefined) return compiled;
  compiled = Object.entries<InputSpec>(def.inputs).map(([name, spec]) => {
    const kind = spec.kind === 'option' ? undefined : spec.kind;
    const boundSI = (b: Bound | undefined) =>
      b === undefined || kind === undefined ? undefined : toSI(b.value, parseUnit(b.unit) as LinearUnit, kind);
    let defaultValue: number | string | readonly number[] | undefined;
    if (spec.default !== undefined) {
      const parsed = readInput(spec, spec.default);
      if (typeof parsed === 'string' && spec.kind !== 'option') throw new Error(`${def.id}.${name}: bad default`);
      defaultValue = typeof parsed === 'string' ? parsed : parsed.value;
    }
    return { name, spec, minSI: boundSI(spec.min), maxSI: boundSI(spec.max), defaultValue };
  });
  compiledCache.set(def, compiled);
  return compiled;
}

/** A value (or each reading of a list) outside the input's min/max, as a message naming it. */
function checkBounds(c: CompiledInput, value: number | string | readonly number[]): string | undefined {
  if (typeof value === 'string') return undefined;
  if (typeof value === 'number') return checkBound(c, value, c.spec.label);
  for (const [i, reading] of value.entries()) {
    const message = checkBound(c, reading, `${c.spec.label}: reading ${i + 1}`);
    if (message !== undefined) return message;
  }
  return undefined;
}

function checkBound(c: CompiledInput, si: number, what: string): string | undefined {
  const { spec, minSI, maxSI } = c;
  const below = minSI !== undefined && (spec.min?.inclusive ? si < minSI : si <= minSI);
  const above = maxSI !== undefined && (spec.max?.inclusive ? si > maxSI : si >= maxSI);
  if (!below && !above) return undefined;
  const b = (below ? spec.min : spec.max) as Bound;
  const limit = `${b.value}${b.unit === '' ? '' : ` ${b.unit}`}`;
  if (below) return `${what} must be ${b.inclusive ? 'at least' : 'above'} ${limit}.`;
  return `${what} must be ${b.inclusive ? 'at most' : 'below'} ${limit}.`;
}

/** Runs one calculator definition on a request. */
export function evaluateDefinition(def: CalculatorDefinition, request: CalculationRequest): CalculationOutcome {
  if (!isRecord(request) || !isRecord(request.inputs)) {
    return { ok: false, errors: [{ field: 'inputs', message: 'The request needs an "inputs" object.' }] };
  }
  const compiled = compile(def);
  const rawInputs: Record<string, unknown> = request.inputs;
  const present = (name: string) => rawInputs[name] !== undefined && rawInputs[name] !== null && rawInputs[name] !== '';
  const errors: FieldError[] = [];
  const known = new Set(compiled.map((c) => c.name));
  for (const name of Object.keys(rawInputs)) {
    if (!known.has(name)) errors.push({ field: name, message: `Unknown input "${name}" for ${def.id}.` });
  }
  const given = new Map<string, Given>();
  for (const c of compiled) {
    if (!present(c.name)) continue;
    const read = readInput(c.spec, rawInputs[c.name]);
    if (typeof read === 'string') {
      errors.push({ field: c.name, message: read });
      continue;
    }
    const outOfRange = checkBounds(c, read.value);
    if (outOfRange !== undefined) errors.push({ field: c.name, message: outOfRange });
    else given.set(c.name, read);
  }
  for (const c of compiled) {
    const required = c.spec.optional !== true && c.spec.group === undefined;
    if (required && !present(c.name)) errors.push({ field: c.name, message: `${c.spec.label} is required.` });
  }
  for (const group of def.groups ?? []) {
    const supplied = group.inputs.filter(present);
    const labels = group.inputs.map((n) => def.inputs[n]?.label ?? n).join(' or ');
    if (supplied.length > 1) {
      for (const n of supplied.slice(1)) errors.push({ field: n, message: `Give only one of ${labels}.` });
    } else if (supplied.length === 0 && group.required) {
      errors.push({ field: group.inputs[0] ?? group.id, message: `Give ${labels}.` });
    }
  }
  const outputUnits = readOutputUnits(def, request.outputUnits, errors);
  if (errors.length > 0) return { ok: false, errors };

  const steps: Step[] = [];
  const warnings: FieldError[] = [];
  const notes: string[] = [];
  const used = new Set<string>();
  const byName = new Map(compiled.map((c) => [c.name, c]));
  const lookup = (name: string): number | string | readonly number[] => {
    used.add(name);
    const g = given.get(name);
    if (g !== undefined) return g.value;
    const d = byName.get(name)?.defaultValue;
    if (d === undefined) throw new Error(`${def.id}: input "${name}" used but not given`);
    return d;
  };
  const ctx: ComputeContext<string> = {
    value: (name) => {
      const v = lookup(name);
      if (typeof v !== 'number') throw new Error(`${def.id}: input "${name}" is not numeric`);
      return v;
    },
    values: (name) => {
      const v = lookup(name);
      if (typeof v === 'number' || typeof v === 'string') throw new Error(`${def.id}: input "${name}" is not a list`);
      return [...v];
    },
    option: (name) => String(lookup(name)),
    has: (name) => given.has(name),
    given: (name) => given.get(name)?.tex ?? '',
    unit: (name) => given.get(name)?.unit ?? '',
    step: (title, formula, substituted, result) => void steps.push({ title, formula, substituted, result }),
    warn: (field, message) => void warnings.push({ field, message }),
    note: (text) => void notes.push(text),
    fail: (field, message) => {
      throw new Refusal(field, message);
    },
  };
  let computed: Partial<Record<string, number>>;
  try {
    computed = def.compute(ctx);
  } catch (e) {
    if (e instanceof Refusal) return { ok: false, errors: [{ field: e.field, message: e.message }] };
    return { ok: false, errors: [{ field: '', message: `The calculation failed: ${(e as Error).message}` }] };
  }
  const conversionStep = inputConversionStep(compiled.filter((c) => used.has(c.name)), given);
  if (conversionStep !== undefined) steps.unshift(conversionStep);
  const outputs: Record<string, QuantityOut> = {};
  const conversions: string[][] = [[], [], []];
  for (const [name, spec] of Object.entries(def.outputs)) {
    const si = computed[name];
    if (si === undefined) continue;
    if (!Number.isFinite(si)) {
      return { ok: false, errors: [{ field: '', message: `${spec.label} came out as ${si}: check the inputs.` }] };
    }
    const wanted = outputUnits.get(name);
    const unitText = wanted?.unit ?? outputSIUnit(spec.kind);
    const unit = wanted ?? (parseUnit(unitText) as LinearUnit);
    const value = fromSI(si, unit, spec.kind);
    outputs[name] = { value, unit: unitText };
    if (wanted !== undefined) {
      conversions[0]?.push(unitFactorTex(unit, spec.kind));
      conversions[1]?.push(`${spec.symbol} = ${qty(si, SI_UNIT[spec.kind])}`);
      conversions[2]?.push(`${spec.symbol} = ${qty(value, unitText)}`);
    }
  }
  if ((conversions[0]?.length ?? 0) > 0) {
    const [f = [], s = [], r = []] = conversions;
    steps.push({ title: 'Express the results in the units asked for', formula: lines(f), substituted: lines(s), result: lines(r) });
  }
  return { ok: true, result: { id: def.id, outputs, steps, warnings, notes } };
}

function readOutputUnits(def: CalculatorDefinition, raw: unknown, errors: FieldError[]): Map<string, LinearUnit> {
  const units = new Map<string, LinearUnit>();
  if (raw === undefined || raw === null) return units;
  if (!isRecord(raw)) {
    errors.push({ field: 'outputUnits', message: 'outputUnits must be an object of output name to unit.' });
    return units;
  }
  for (const [name, unitText] of Object.entries(raw)) {
    const outputs = def.outputs as Record<string, { kind: QuantityKind; label: string }>;
    const spec = Object.hasOwn(outputs, name) ? outputs[name] : undefined;
    const field = `outputUnits.${name}`;
    if (spec === undefined) {
      errors.push({ field, message: `Unknown output "${name}" for ${def.id}.` });
      continue;
    }
    const unit = typeof unitText === 'string' ? parseUnit(unitText) : undefined;
    if (unit === undefined) {
      errors.push({ field, message: `${spec.label}: unknown unit "${String(unitText)}". Use one of ${unitList(spec.kind)}.` });
    } else if (unit.dimensions !== dimensionsOf(spec.kind)) {
      errors.push({ field, message: `${spec.label}: "${unitText}" is not a unit of ${kindName(spec.kind)}.` });
    } else {
      units.set(name, unit);
    }
  }
  return units;
}

/** `1\,\mathrm{psi} = 6894.757\,\mathrm{Pa}`, or the offset form for °C/°F. */
function unitFactorTex(unit: LinearUnit, kind: QuantityKind): string {
  const si = unitTex(SI_UNIT[kind]);
  const u = unitTex(unit.unit);
  if (kind !== 'temperatureDifference' && unit.offset !== 0) {
    const shift = num(unit.offset / unit.scale, 6);
    const scale = unit.scale === 1 ? '' : ` \\times ${num(unit.scale, 7)}`;
    return `T\\,[${si}] = (t\\,[${u}] + ${shift})${scale}`;
  }
  return `1\\,${u === '' ? '' : u} = ${qty(unit.scale, SI_UNIT[kind], 7)}`;
}

function inputConversionStep(compiled: CompiledInput[], given: Map<string, Given>): Step | undefined {
  const formula: string[] = [];
  const substituted: string[] = [];
  const result: string[] = [];
  for (const c of compiled) {
    const g = given.get(c.name);
    if (g?.conversion === undefined || c.spec.kind === 'option' || typeof g.value === 'string') continue;
    const kind = c.spec.kind;
    const { unit, raw } = g.conversion;
    const sym = c.spec.symbol;
    const siText = SI_UNIT[kind];
    // One line per conversion factor: two inputs in the same unit share it.
    const factor = unitFactorTex(unit, kind);
    if (!formula.includes(factor)) formula.push(factor);
    // A list of readings reads (a,\ b,\ c) and wraps after six readings.
    const rawLines = typeof raw === 'number' ? [num(raw, 8)] : listLinesTex(raw, 8);
    const siLines = typeof g.value === 'number' ? [num(g.value)] : listLinesTex(g.value);
    if (kind !== 'temperatureDifference' && unit.offset !== 0) {
      const shift = num(unit.offset / unit.scale, 6);
      const scale = unit.scale === 1 ? '' : ` \\times ${num(unit.scale, 7)}`;
      substituted.push(...wrapLines(`${sym} = (`, rawLines, ` + ${shift})${scale}\\,${unitTex(siText)}`));
    } else {
      substituted.push(...wrapLines(`${sym} = `, rawLines, ` \\times ${qty(unit.scale, siText, 7)}`));
    }
    const siUnit = unitTex(siText);
    result.push(...wrapLines(`${sym} = `, siLines, siUnit === '' ? '' : `\\,${siUnit}`));
  }
  if (formula.length === 0) return undefined;
  return { title: 'Convert the inputs to SI units', formula: lines(formula), substituted: lines(substituted), result: lines(result) };
}
