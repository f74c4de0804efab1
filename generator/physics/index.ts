/**
 * Property functions of water, steam, air, pot metals and the atmosphere. SI in, SI out;
 * each throws OutOfRangeError outside its correlation's published range.
 */
export * from './constants.ts';
export { OutOfRangeError } from './errors.ts';
export {
  saturationPressurePa,
  saturationPressureSlopePaPerK,
  saturationTemperatureK,
} from './if97-region4.ts';
export { region1, type LiquidState } from './if97-region1.ts';
export { region2SpecificVolumeM3PerKg } from './if97-region2.ts';
export { vaporisationEnthalpyIf97JPerKg } from './if97-vaporisation.ts';
export {
  saturatedLiquidDensityKgM3,
  saturatedLiquidEnthalpyJPerKg,
  saturatedVapourDensityKgM3,
  saturatedVapourEnthalpyJPerKg,
  vaporisationEnthalpyJPerKg,
} from './saturation.ts';
export { waterViscosityPaS } from './viscosity.ts';
export { airIsobaricMolarHeatCapacity, airIsochoricMolarHeatCapacity } from './air.ts';
export { metalDensityKgM3, metalSpecificHeatJPerKgK, type MetalName } from './metals.ts';
export { ambientPressurePa } from './atmosphere.ts';
