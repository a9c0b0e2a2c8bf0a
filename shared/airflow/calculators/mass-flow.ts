import { bound, defineCalculator } from '../define';
import { qty } from '../latex';
import { density } from './common-inputs';

export const massFlow = defineCalculator({
  id: 'mass-flow',
  title: 'Mass flow and volume flow',
  topic: 'Mass flow',
  summary:
    'Turns a volume flow into mass flow with the air density (ṁ = ρ·Q), or a mass flow back into volume flow. Mass is conserved through an intake; volume is not.',
  inputs: {
    volumeFlow: {
      label: 'Volume flow',
      symbol: 'Q',
      kind: 'volumeFlow',
      group: 'flow',
      min: bound(0, 'm^3/s'),
      example: { value: 450, unit: 'cfm' },
      exampleSi: { value: 200, unit: 'L/s' },
      help: 'Volume flow measured where the air has the density given below.',
    },
    massFlow: {
      label: 'Mass flow',
      symbol: '\\dot m',
      kind: 'massFlow',
      group: 'flow',
      min: bound(0, 'kg/s'),
      example: { value: 35, unit: 'lb/min' },
      exampleSi: { value: 250, unit: 'g/s' },
      help: 'Give a mass flow instead to find the volume it takes at this density.',
    },
    density: {
      ...density('Air density', { value: 0.075, unit: 'lb/ft^3' },
        'Density of the air where the volume flow is measured (0.075 lb/ft³, or 1.2 kg/m³, is the usual round figure for standard air, shop common practice).'),
      // 1.2 kg/m³: air near 20 °C at sea level, the metric round figure (shop common practice).
      exampleSi: { value: 1.2, unit: 'kg/m^3' },
    },
  },
  groups: [{ id: 'flow', label: 'Volume flow or mass flow', inputs: ['volumeFlow', 'massFlow'], required: true }],
  outputs: {
    massFlow: { label: 'Mass flow', symbol: '\\dot m', kind: 'massFlow', us: 'lb/min' },
    volumeFlow: { label: 'Volume flow', symbol: 'Q', kind: 'volumeFlow', us: 'cfm' },
  },
  compute(ctx) {
    const rho = ctx.value('density');
    if (ctx.has('volumeFlow')) {
      const q = ctx.value('volumeFlow');
      const m = rho * q;
      ctx.step('Mass flow is density times volume flow', '\\dot m = \\rho\\,Q',
        `\\dot m = ${qty(rho, 'kg/m^3')} \\times ${qty(q, 'm^3/s')}`, `\\dot m = ${qty(m, 'kg/s')}`);
      return { massFlow: m, volumeFlow: q };
    }
    const m = ctx.value('massFlow');
    const q = m / rho;
    ctx.step('Volume flow is mass flow divided by density', 'Q = \\frac{\\dot m}{\\rho}',
      `Q = \\frac{${qty(m, 'kg/s')}}{${qty(rho, 'kg/m^3')}}`, `Q = ${qty(q, 'm^3/s')}`);
    return { massFlow: m, volumeFlow: q };
  },
});
