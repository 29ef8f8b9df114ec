// Pressure waves in the intake runner and the exhaust primaries: a linear acoustic delay-line model
// (Heywood ch. 7, wave action; the linear limit of the method of characteristics). Flow through the
// valve launches a wave of amplitude Δp = c·ṁ/A into the pipe (acoustic impedance of a mass flux);
// each area change or open end reflects it back to the valve after its round-trip time 2L/c with a
// reflection coefficient R = (A₁ − A₂)/(A₁ + A₂) (−1 at an open end into a large volume), attenuated
// per round trip. The valve end is treated as closed (R = +1), so echoes of echoes follow by recursion.
// This is what makes runner length, primary length and size, and an open or full exhaust act through
// physics: ram and reversion at the valve, not a multiplier per part.

export type Echo = { delayS: number; gain: number };

export type WavePipe = {
  echoes: Echo[];
  impedanceSPerM2: number; // c / A: pressure (Pa) per unit mass flow (kg/s)
  forward: Float64Array; // the forward wave over the last cycle, one slot per crank step
};

export function makeWavePipe(echoes: Echo[], soundSpeedMPerS: number, areaM2: number, slots: number): WavePipe {
  return { echoes, impedanceSPerM2: soundSpeedMPerS / areaM2, forward: new Float64Array(slots) };
}

// Linear acoustics: the backward wave at the valve is the sum of delayed, reflected forward waves.
export function backwardWavePa(pipe: WavePipe, slot: number, secondsPerSlot: number): number {
  const n = pipe.forward.length;
  let sum = 0;
  for (const e of pipe.echoes) {
    const lag = e.delayS / secondsPerSlot;
    const whole = Math.floor(lag);
    const frac = lag - whole;
    const i0 = (((slot - whole) % n) + n) % n;
    const i1 = (i0 - 1 + n) % n;
    sum += e.gain * (pipe.forward[i0] * (1 - frac) + pipe.forward[i1] * frac);
  }
  return sum;
}

/** Records this step's forward wave: the valve's own source plus the backward wave reflected at the closed end. */
export function launchWave(pipe: WavePipe, slot: number, outwardMassFlowKgPerS: number, backwardPa: number): void {
  pipe.forward[slot] = pipe.impedanceSPerM2 * outwardMassFlowKgPerS + backwardPa;
}

// Acoustics: reflection coefficient (pressure) of a wave meeting an area change A₁ → A₂.
export function reflectionCoefficient(fromAreaM2: number, toAreaM2: number): number {
  return (fromAreaM2 - toAreaM2) / (fromAreaM2 + toAreaM2);
}
