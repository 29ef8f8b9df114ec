import type { ConverterDetail, FitDetail } from './scoring';
import type { Need } from './types';
import { groupThousands, inches } from './format';

// What the cam requires, structured so the catalogue's rules can map each kind to parts and labour.
export function camNeeds(fit: FitDetail, converter: ConverterDetail): Need[] {
  const needs: Need[] = [];
  if (fit.springsNeeded) {
    needs.push({
      kind: 'springs',
      reason: `Lift ${inches(fit.maxLiftIn)} exceeds the installed springs' ${inches(fit.springLimitIn)} limit${fit.springLimitAssumed ? ' (assumed from the current cam)' : ''}.`,
      minLiftIn: fit.maxLiftIn,
    });
  }
  if (fit.deleteNeeded) {
    needs.push({ kind: 'deactivation-delete', reason: 'The engine has active cylinder deactivation and this cam is not listed as compatible.' });
  }
  if (converter.suggestedStallRpm !== null && converter.crossoverRpm !== null) {
    needs.push({
      kind: 'converter',
      reason: `The cam starts to pull at about ${groupThousands(Math.round(converter.crossoverRpm / 100) * 100)} rpm, well above the ${groupThousands(converter.pullAwayRpm)} rpm stall.`,
      suggestedStallRpm: converter.suggestedStallRpm,
    });
  }
  // Every cam swap changes airflow and idle: the engine must be re-tuned.
  needs.push({ kind: 'tune', reason: 'Every cam swap needs the engine re-tuned for the new airflow and idle.' });
  return needs;
}
