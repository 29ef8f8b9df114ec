import { IDLE_VACUUM } from './idle';
import type { ConverterDetail, EmissionsDetail, FitDetail, IdleDetail } from './scoring';
import type { Caution } from './types';

// Plain-text cautions shown with every cam. They defer to local codes and to licensed practice;
// the advisor never says a part is legal or safe, only what must be checked and by whom.
export function camCautions(
  emissions: EmissionsDetail,
  idle: IdleDetail,
  fit: FitDetail,
  converter: ConverterDetail,
  hasVacuumBrakes: boolean,
): Caution[] {
  const out: Caution[] = [];
  if (emissions.gated) {
    out.push({
      kind: 'emissions',
      text: 'This cam is not emissions-certified and the customer needs a road-legal vehicle. Many places forbid an uncertified cam on a road vehicle; follow local codes.',
    });
  } else if (!emissions.certified) {
    out.push({
      kind: 'emissions',
      text: 'This cam is not emissions-certified. The customer says road-legal emissions are not needed; confirm that against local codes before it goes on a road vehicle.',
    });
  }
  if (hasVacuumBrakes && idle.vacuumInHg < IDLE_VACUUM.brakeBoosterMinInHg) {
    out.push({
      kind: 'brakes',
      text: `Estimated idle vacuum of about ${Math.round(idle.vacuumInHg)} inHg is below the roughly 15 inHg vacuum brake boosters want; less vacuum means less brake assist. Have a qualified technician check the brakes; a vacuum pump or other assist may be needed.`,
    });
  }
  out.push({
    kind: 'valvetrain',
    text: `Valve springs, piston-to-valve clearance and pushrod length must be checked by a qualified technician before the engine is started${fit.ptvLevel === 'high' ? '; piston-to-valve risk is high with this cam' : ''}.`,
  });
  if (converter.suggestedStallRpm !== null) {
    out.push({
      kind: 'converter',
      text: 'A higher-stall converter changes how the vehicle creeps and launches; tell the customer before the first drive.',
    });
  }
  out.push({
    kind: 'tune',
    text: 'The engine must be re-tuned after the swap, by a licensed or qualified tuner where local rules require it.',
  });
  return out;
}
