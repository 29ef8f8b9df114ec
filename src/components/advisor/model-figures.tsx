'use client';

import useSWR from 'swr';
import type { ModelDetail } from '@/lib/advisor';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import { postForJson } from '@/lib/api-client';

const fetchDetail = ([url, build, camId]: [string, BuildProfile, number | 'baseline']) =>
  postForJson<ModelDetail>(url, { build, camId });

const cell = 'px-2 py-1 text-right';

/** The cycle model's own figures for one cam: loaded only when someone opens "how these numbers were reached". */
export function ModelFigures({ build, camId }: { build: BuildProfile; camId: number | 'baseline' }) {
  const { data, error, isLoading } = useSWR(['/api/advisor/model', build, camId], fetchDetail, {
    revalidateOnFocus: false,
  });
  if (isLoading)
    return (
      <p role="status" className="text-xs text-ink-muted">
        Running the cycle model for this cam…
      </p>
    );
  if (error || !data)
    return (
      <p role="alert" className="text-xs text-fault-700">
        Could not load the model’s figures: {error?.message ?? 'no answer'}. Close and open this section to try again.
      </p>
    );
  const opens = (key: 'intakeIn' | 'exhaustIn') => data.lift.filter((l) => l[key] > 0);
  const span = (key: 'intakeIn' | 'exhaustIn') => {
    const open = opens(key);
    return open.length
      ? `${open[0].crankDeg}°–${open[open.length - 1].crankDeg}°, peak ${Math.max(...open.map((l) => l[key])).toFixed(3)}"`
      : 'closed';
  };
  return (
    <div className="mt-3 flex flex-col gap-3">
      <p className="text-xs text-ink-soft">
        The engine-cycle model, step by step: the valves open over the crank angles below (firing TDC at 0°, overlap at
        360°; intake {span('intakeIn')}, exhaust {span('exhaustIn')}); the head passes the bench flow in the second
        table at each lift; per rpm the model traps a charge (volumetric efficiency), burns it, and the mean effective
        pressures give the torque: BMEP = IMEP − friction (IMEP is net of pumping), torque = BMEP × displacement ÷ 4π
        (Heywood, ch. 2).
      </p>
      <div className="overflow-x-auto">
        <table className="spec w-full text-xs">
          <caption className="text-left font-sans font-semibold">Per simulated rpm</caption>
          <thead className="text-ink-muted">
            <tr>
              <th scope="col" className={cell}>
                rpm
              </th>
              <th scope="col" className={cell}>
                VE %
              </th>
              <th scope="col" className={cell}>
                residual %
              </th>
              <th scope="col" className={cell}>
                IMEP psi
              </th>
              <th scope="col" className={cell}>
                pumping psi
              </th>
              <th scope="col" className={cell}>
                friction psi
              </th>
              <th scope="col" className={cell}>
                BMEP psi
              </th>
              <th scope="col" className={cell}>
                torque lb·ft
              </th>
              <th scope="col" className={cell}>
                spark retard °
              </th>
            </tr>
          </thead>
          <tbody>
            {data.simulated.map((p) => (
              <tr key={p.rpm} className="border-t border-steel-100">
                <td className={cell}>{p.rpm.toLocaleString('en-US')}</td>
                <td className={cell}>{p.volumetricEfficiencyPct.toFixed(1)}</td>
                <td className={cell}>{p.residualGasPct.toFixed(1)}</td>
                <td className={cell}>{p.imepPsi.toFixed(1)}</td>
                <td className={cell}>{p.pumpingPsi.toFixed(1)}</td>
                <td className={cell}>{p.frictionPsi.toFixed(1)}</td>
                <td className={cell}>{p.bmepPsi.toFixed(1)}</td>
                <td className={cell}>{p.torqueLbFt.toFixed(1)}</td>
                <td className={cell}>{p.sparkRetardDeg}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="overflow-x-auto">
        <table className="spec text-xs">
          <caption className="text-left font-sans font-semibold">
            Head flow against valve lift (cfm at 28 inH₂O)
          </caption>
          <thead className="text-ink-muted">
            <tr>
              <th scope="col" className={cell}>
                lift in
              </th>
              <th scope="col" className={cell}>
                intake
              </th>
              <th scope="col" className={cell}>
                exhaust
              </th>
            </tr>
          </thead>
          <tbody>
            {data.headFlow.map((f) => (
              <tr key={f.liftIn} className="border-t border-steel-100">
                <td className={cell}>{f.liftIn.toFixed(3)}</td>
                <td className={cell}>{f.intakeCfm}</td>
                <td className={cell}>{f.exhaustCfm}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-muted">
        Fitted constants: combustion efficiency {data.fittedConstants.combustionEfficiency}, friction scale{' '}
        {data.fittedConstants.frictionScale}, wave attenuation {data.fittedConstants.waveAttenuation}, burn duration{' '}
        {data.fittedConstants.burnDurationDeg}° (docs/advisor.md gives their published ranges and the fit).
      </p>
    </div>
  );
}
