/** A brew result in trade units: the JSON of `stovecard simulate --json` and its summary. */
import type { BrewResult } from '../brew/types.ts';
import { round, toBar, toCelsius, toMl } from '../units.ts';

const orNull = <T>(value: number | null, f: (v: number) => T): T | null =>
  value === null ? null : f(value);

export function brewJson(r: BrewResult) {
  return {
    firstCoffeeS: orNull(r.firstCoffeeS, (v) => round(v, 1)),
    firstCoffeeC: orNull(r.firstCoffeeK, (v) => round(toCelsius(v), 1)),
    sputterS: orNull(r.sputterS, (v) => round(v, 1)),
    heatOffS: orNull(r.heatOffS, (v) => round(v, 1)),
    endS: round(r.endS, 1),
    endReason: r.endReason,
    yieldMl: round(toMl(r.yieldM3), 1),
    leftInBaseMl: round(toMl(r.leftInBaseM3), 1),
    retainedMl: round(toMl(r.retainedM3), 1),
    doseG: round(r.doseKg * 1000, 1),
    extraction: r.extraction && {
      meanC: round(toCelsius(r.extraction.meanK), 1),
      p10C: round(toCelsius(r.extraction.p10K), 1),
      p50C: round(toCelsius(r.extraction.p50K), 1),
      p90C: round(toCelsius(r.extraction.p90K), 1),
      inBandShare: round(r.extraction.inBandShare, 3),
    },
    peakGaugeBar: round(toBar(r.peakGaugePa), 3),
    valveOpens: r.valveOpens,
    flash: {
      boilingC: round(toCelsius(r.flash.boilingK), 2),
      flashedG: round(r.flash.flashedKg * 1000, 2),
      aboveBoilingMl: round(toMl(r.flash.aboveBoilingM3), 1),
    },
    series: r.series.map((p) => ({
      tS: round(p.tS, 1),
      waterC: round(toCelsius(p.waterK), 2),
      coffeeC: round(toCelsius(p.coffeeK), 2),
      spoutC: round(toCelsius(p.spoutK), 2),
      gaugeBar: round(toBar(p.gaugePa), 4),
      cupMl: round(toMl(p.cupM3), 2),
      flowMlS: round(toMl(p.flowM3PerS), 3),
    })),
  };
}

const clock = (s: number | null): string =>
  s === null ? '—' : `${Math.floor(s / 60)}:${String(Math.round(s % 60)).padStart(2, '0')}`;

export function brewSummary(r: BrewResult, fillMl: number): string {
  const e = r.extraction;
  const lines = [
    `fill ${fillMl} mL, dose ${round(r.doseKg * 1000, 1)} g (level basket, not tamped)`,
    `first coffee   ${clock(r.firstCoffeeS)}${r.firstCoffeeK !== null ? ` at ${round(toCelsius(r.firstCoffeeK), 1)} °C` : ''}`,
    `heat off       ${clock(r.heatOffS)}`,
    `sputter        ${clock(r.sputterS)}`,
    `ended          ${clock(r.endS)} (${r.endReason})`,
    `yield          ${round(toMl(r.yieldM3))} mL; ${round(toMl(r.leftInBaseM3))} mL left in the base, ${round(toMl(r.retainedM3))} mL in the grounds and tubes`,
    e
      ? `extraction     mean ${round(toCelsius(e.meanK), 1)} °C (10 % ${round(toCelsius(e.p10K), 1)}, median ${round(toCelsius(e.p50K), 1)}, 90 % ${round(toCelsius(e.p90K), 1)}); ${round(e.inBandShare * 100)} % in the target band`
      : 'extraction     no coffee reached the cup',
    `peak pressure  ${round(toBar(r.peakGaugePa), 2)} bar gauge${r.valveOpens ? ' — THE VALVE WOULD OPEN' : ''}`,
    ...(r.flash.flashedKg > 0
      ? [
          `flash          ${round(toMl(r.flash.aboveBoilingM3))} mL reached the spout above ${round(toCelsius(r.flash.boilingK), 1)} °C; up to ${round(r.flash.flashedKg * 1000, 1)} g flashed to steam there`,
        ]
      : []),
  ];
  return lines.join('\n') + '\n';
}
