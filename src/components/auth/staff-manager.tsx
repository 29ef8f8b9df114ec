'use client';

import { Form, Formik } from 'formik';
import { useState } from 'react';
import useSWR from 'swr';
import { EMAIL_MAX } from '@/lib/schemas/auth';
import { NAME_MAX, ROLE_LABELS, STAFF_ROLE_VALUES } from '@/lib/schemas/user';
import { formErrors, getJson, sendJson, useVersionedSave } from '@/lib/api-client';
import { inviteChecks } from '@/lib/forms/account-checks';
import { TextField } from '@/components/ui/formik-fields';
import { Banner } from '@/components/ui/banner';
import { ConflictBanner } from '@/components/ui/conflict-banner';
import { SubmitButton } from '@/components/ui/button';
import { dateTime } from '@/lib/format';

type Role = (typeof STAFF_ROLE_VALUES)[number];
type StaffRow = {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  version: number;
  hasPassword: boolean;
  lastSignInAt: string | null;
};
type Message = { tone: 'ok' | 'fault' | 'caution'; text: string };

const fetchStaff = (url: string) => getJson<{ users: StaffRow[] }>(url).then((body) => body.users);

function stateOf(row: StaffRow): { word: string; style: string } {
  if (!row.active) return { word: 'Switched off', style: 'bg-steel-100 text-ink-muted' };
  if (!row.hasPassword) return { word: 'Invited', style: 'bg-caution-100 text-caution-700' };
  return { word: 'Active', style: 'bg-ok-100 text-ok-700' };
}

export function StaffManager({ selfId }: { selfId: number }) {
  const { data, error, isLoading, mutate } = useSWR('/api/users', fetchStaff);
  const [message, setMessage] = useState<Message | null>(null);

  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="staff-list-title">
        <h2 id="staff-list-title" className="sr-only">
          Staff accounts
        </h2>
        <div aria-live="polite" className="mb-3 min-h-[2.5rem]">
          {message ? <Banner tone={message.tone}>{message.text}</Banner> : null}
        </div>
        {error ? <Banner tone="fault">{(error as Error).message}</Banner> : null}
        {isLoading ? <p className="text-sm text-ink-muted">Loading the staff list…</p> : null}
        {data ? (
          // A phone scrolls the table, not the page (each row carries a role picker and buttons); relative keeps
          // the screen-reader-only header text, positioned absolutely, inside the scrolling box.
          <div className="relative overflow-x-auto">
            <table className="w-full border-collapse text-sm">
              <thead>
                <tr className="border-b border-steel-300 text-left text-ink-muted">
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    Name
                  </th>
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    E-mail
                  </th>
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    Role
                  </th>
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    State
                  </th>
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    Last sign-in
                  </th>
                  <th scope="col" className="py-2 font-semibold">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {data.map((row) => (
                  <StaffRowView
                    key={row.id}
                    row={row}
                    self={row.id === selfId}
                    onMessage={setMessage}
                    reload={() => mutate()}
                  />
                ))}
              </tbody>
            </table>
          </div>
        ) : null}
      </section>

      <section
        aria-labelledby="invite-title"
        className="max-w-xl rounded-lg border border-steel-300 bg-paper-raised p-6"
      >
        <h2 id="invite-title" className="text-lg font-semibold">
          Invite someone
        </h2>
        <p className="mb-4 text-sm text-ink-soft">
          They get an e-mail with a link to choose their password (it works once, for 72 hours).
        </p>
        <InviteForm
          onInvited={async (text) => {
            setMessage({ tone: 'ok', text });
            await mutate();
          }}
        />
      </section>
    </div>
  );
}

/**
 * One account's row. Each change sends the version the list last read (useVersionedSave); someone else's newer
 * save answers 409: the list reloads to show theirs, and a row beneath offers to keep the change made here
 * (sent again on top of theirs) or take theirs as it stands.
 */
function StaffRowView({
  row,
  self,
  onMessage,
  reload,
}: {
  row: StaffRow;
  self: boolean;
  onMessage: (message: Message | null) => void;
  reload: () => Promise<unknown>;
}) {
  const { conflict, save, settle } = useVersionedSave<StaffRow>(row);
  const [busy, setBusy] = useState(false);
  const [mine, setMine] = useState<{ patch: { role?: Role; active?: boolean }; done: string } | null>(null);
  const state = stateOf(row);

  /** `onVersion`: send on this version (theirs, after "keep mine") rather than the one this row last read. */
  async function change(patch: { role?: Role; active?: boolean }, done: string, onVersion?: number) {
    setBusy(true);
    onMessage(null);
    const answer = await save(
      'PATCH',
      `/api/users/${row.id}`,
      onVersion === undefined ? patch : { ...patch, version: onVersion },
    );
    setBusy(false);
    if (answer.status === 200) {
      onMessage({ tone: 'ok', text: done });
      setMine(null);
    } else if (answer.status === 409) {
      onMessage({
        tone: 'caution',
        text: `${answer.body.message ?? 'Someone else changed this account.'} The table now shows the current details.`,
      });
      setMine({ patch, done });
    } else
      onMessage({
        tone: 'fault',
        text:
          answer.body.errors?.map((e) => e.message).join('; ') ||
          answer.body.message ||
          `That did not work (${answer.status}).`,
      });
    await reload();
  }

  const wanted = mine
    ? mine.patch.role
      ? `make them ${ROLE_LABELS[mine.patch.role].toLowerCase()}`
      : mine.patch.active
        ? 'switch the account on'
        : 'switch the account off'
    : '';
  return (
    <>
      <tr className="border-b border-steel-100 align-middle">
        <td className="py-1.5 pr-3">
          {row.name}
          {self ? <span className="ml-1 text-ink-muted">(you)</span> : null}
        </td>
        <td className="spec py-1.5 pr-3">{row.email}</td>
        <td className="py-1.5 pr-3">
          <label className="sr-only" htmlFor={`role-${row.id}`}>
            Role of {row.name}
          </label>
          <select
            id={`role-${row.id}`}
            value={row.role}
            disabled={self || busy || Boolean(conflict)}
            onChange={(event) =>
              change(
                { role: event.target.value as Role },
                `${row.name} is now ${ROLE_LABELS[event.target.value as Role].toLowerCase()}.`,
              )
            }
            className="rounded border border-steel-300 bg-paper-raised px-2 py-1"
          >
            {STAFF_ROLE_VALUES.map((role) => (
              <option key={role} value={role}>
                {ROLE_LABELS[role]}
              </option>
            ))}
          </select>
        </td>
        <td className="py-1.5 pr-3">
          <span className={`rounded px-2 py-0.5 text-xs font-semibold ${state.style}`}>{state.word}</span>
        </td>
        <td className="spec py-1.5 pr-3 text-ink-soft">{row.lastSignInAt ? dateTime(row.lastSignInAt) : 'never'}</td>
        <td className="py-1.5 text-right">
          {self ? null : (
            <button
              type="button"
              disabled={busy || Boolean(conflict)}
              onClick={() => {
                if (row.active && !window.confirm(`Switch off ${row.name}'s account? They are signed out at once.`))
                  return;
                void change(
                  { active: !row.active },
                  row.active
                    ? `${row.name}'s account is switched off and signed out.`
                    : `${row.name}'s account is switched on again.`,
                );
              }}
              className={`rounded px-3 py-1 text-xs font-semibold ring-1 ${row.active ? 'text-fault-700 ring-fault-700/50 hover:bg-fault-100' : 'text-ok-700 ring-ok-700/50 hover:bg-ok-100'}`}
            >
              {row.active ? 'Switch off' : 'Switch on'}
            </button>
          )}
        </td>
      </tr>
      {conflict && mine ? (
        <tr>
          <td colSpan={6} className="pb-2">
            <ConflictBanner
              title={`Someone else changed ${conflict.name}'s account first. Nothing was overwritten.`}
              onTheirs={() => {
                settle();
                setMine(null);
                onMessage(null);
              }}
              onMine={() => {
                const theirs = settle();
                const again = mine;
                setMine(null);
                void change(again.patch, again.done, theirs?.version);
              }}
              theirsLabel="Leave it as they saved it"
              mineLabel={`Still ${wanted}`}
            >
              Theirs: {ROLE_LABELS[conflict.role]}, {stateOf(conflict).word.toLowerCase()}. You asked to {wanted}.
            </ConflictBanner>
          </td>
        </tr>
      ) : null}
    </>
  );
}

type InviteValues = { email: string; name: string; role: Role };

function InviteForm({ onInvited }: { onInvited: (text: string) => Promise<void> }) {
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Formik<InviteValues>
      initialValues={{ email: '', name: '', role: 'counter' }}
      validate={inviteChecks}
      onSubmit={async (values, helpers) => {
        setProblem(null);
        const answer = await sendJson('POST', '/api/users', values);
        if (answer.status === 201) {
          helpers.resetForm();
          await onInvited(`Invitation sent to ${values.email}.`);
          return;
        }
        if (answer.status === 422) helpers.setErrors(formErrors<InviteValues>(answer));
        setProblem(answer.body.message ?? `That did not work (${answer.status}).`);
      }}
    >
      {({ isSubmitting, values, setFieldValue }) => (
        <Form className="flex flex-col gap-4" noValidate>
          {problem ? <Banner tone="fault">{problem}</Banner> : null}
          <TextField namedErrors name="name" label="Name" autoComplete="off" maxLength={NAME_MAX} />
          <TextField namedErrors name="email" label="E-mail" type="email" autoComplete="off" maxLength={EMAIL_MAX} />
          <div className="flex flex-col gap-1">
            <label htmlFor="invite-role" className="text-sm font-semibold">
              Role
            </label>
            <select
              id="invite-role"
              value={values.role}
              onChange={(e) => setFieldValue('role', e.target.value)}
              className="rounded border border-steel-300 bg-paper-raised px-3 py-2"
            >
              {STAFF_ROLE_VALUES.map((role) => (
                <option key={role} value={role}>
                  {ROLE_LABELS[role]}
                </option>
              ))}
            </select>
          </div>
          <div>
            <SubmitButton busy={isSubmitting}>Invite</SubmitButton>
          </div>
        </Form>
      )}
    </Formik>
  );
}
