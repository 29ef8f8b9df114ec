import { StateTag } from '@/components/ui/state-tag';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import type { SignOffView } from '@/lib/jobs/types';
import { LIMITS_NOTE } from '@/lib/jobs/sign-off-limits';
import { READINGS } from './sign-off-fields';

// The latest sign-off as it prints on the job sheet: each reading with its unit, the usual limit, and
// "Check" in words where it falls outside.
export function SignOffSheet({ signOff }: { signOff: SignOffView }) {
  const warned = new Map(signOff.warnings.map((w) => [w.field, w.message]));
  return (
    <section aria-labelledby="sign-off-title" className="break-inside-avoid">
      <h3 id="sign-off-title" className="font-semibold">
        Sign-off before first start
      </h3>
      <p className="text-sm">
        Signed off by {signOff.signedBy ?? 'a former staff member'} on{' '}
        <span className="spec">{signOff.signedAt.slice(0, 16).replace('T', ' ')}</span> UTC · tune file{' '}
        <span className="spec font-semibold">{signOff.tuneFile}</span>
      </p>
      <table className={tableClass}>
        <caption className="sr-only">Measured at the sign-off</caption>
        <thead>
          <tr>
            <th scope="col" className={thClass}>
              Check
            </th>
            <th scope="col" className={`${thClass} text-right`}>
              Measured
            </th>
            <th scope="col" className={thClass}>
              Usual (from memory)
            </th>
            <th scope="col" className={thClass}>
              Result
            </th>
          </tr>
        </thead>
        <tbody>
          {READINGS.map((r) => (
            <tr key={r.key}>
              <td className={tdClass}>{r.label}</td>
              <td className={`${tdClass} spec whitespace-nowrap text-right`}>
                {signOff[r.key].toFixed(r.digits)} {r.unit}
              </td>
              <td className={`${tdClass} text-xs`}>{r.usual}</td>
              <td className={tdClass}>
                {warned.has(r.key) ? (
                  <StateTag tone="caution">Check</StateTag>
                ) : (
                  <StateTag tone="ok">Within usual</StateTag>
                )}
              </td>
            </tr>
          ))}
          {signOff.deactivationDeleteDone !== null ? (
            <tr>
              <td className={tdClass}>Cylinder deactivation delete</td>
              <td className={`${tdClass} text-right`}>{signOff.deactivationDeleteDone ? 'Done' : 'Left in place'}</td>
              <td className={`${tdClass} text-xs`}>delete, or a cam and tune made for deactivation</td>
              <td className={tdClass}>
                {warned.has('deactivationDeleteDone') ? (
                  <StateTag tone="caution">Check</StateTag>
                ) : (
                  <StateTag tone="ok">Done</StateTag>
                )}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
      {signOff.warnings.length ? (
        <ul className="mt-2 list-disc pl-5 text-sm text-caution-700">
          {signOff.warnings.map((w) => (
            <li key={w.field + w.message}>{w.message}</li>
          ))}
        </ul>
      ) : null}
      {signOff.notes ? <p className="mt-2 whitespace-pre-line text-sm">{signOff.notes}</p> : null}
      <p className="mt-1 text-xs text-ink-muted">{LIMITS_NOTE}</p>
    </section>
  );
}
