'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useLayoutEffect, useRef, useState } from 'react';
import { CHOICE_QUESTIONS, QUESTION_COUNT } from '@/lib/leads/questions';
import { LEAD_LIMITS } from '@/lib/leads/limits';
import { sendJson } from '@/lib/api-client';
import { CheckboxControl, TextControl } from '@/components/ui/field';

// The at-home questionnaire: one question per screen, big targets, plain words. Answers live in
// sessionStorage so a reload (or a phone that drops the tab) keeps them until they are sent. The server
// renders the first question, so a phone shows it before any script has arrived (Lighthouse measured the
// browser-only version at LCP 3.7 s); the saved place is restored as soon as the page is live.
// v2: the vehicle question moved every later step by one, so answers saved under v1 are not resumed.
export const STORAGE_KEY = 'lobewise.ask.v2';

type Answers = Record<string, string> & { name?: string; email?: string; phone?: string; consent?: string };
type Saved = { step: number; answers: Answers };
type FieldErrors = Record<string, string>;

function loadSaved(): Saved {
  try {
    const raw = window.sessionStorage.getItem(STORAGE_KEY);
    if (raw) {
      const parsed = JSON.parse(raw) as Saved;
      if (typeof parsed.step === 'number' && parsed.answers && typeof parsed.answers === 'object') {
        return { step: Math.min(Math.max(0, Math.trunc(parsed.step)), QUESTION_COUNT - 1), answers: parsed.answers };
      }
    }
  } catch {
    // Storage switched off or unreadable: start afresh.
  }
  return { step: 0, answers: {} };
}

const primaryButton =
  'min-h-14 rounded-lg bg-ember-500 px-6 py-3 text-xl font-semibold text-paper-raised hover:bg-ember-600 focus-visible:outline focus-visible:outline-4 focus-visible:outline-offset-2 focus-visible:outline-gauge-500 disabled:opacity-60';
const quietButton =
  'min-h-14 rounded-lg border-2 border-steel-500 bg-paper-raised px-6 py-3 text-xl font-semibold text-ink hover:bg-paper-sunk focus-visible:outline focus-visible:outline-4 focus-visible:outline-offset-2 focus-visible:outline-gauge-500';

export function Questionnaire() {
  const router = useRouter();
  const [{ step, answers }, setSaved] = useState<Saved>({ step: 0, answers: {} });
  // Until the page is live (and the saved place restored) Next stays disabled: a press would submit the bare form.
  const [restored, setRestored] = useState(false);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [sending, setSending] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  const stepChangedByPerson = useRef(false);

  // sessionStorage exists only in the browser: read it once the server's markup is live, before the next paint.
  useLayoutEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the one read of browser-only storage after hydration
    setSaved(loadSaved());
    setRestored(true);
  }, []);

  useEffect(() => {
    if (!restored) return; // never overwrite the saved answers with the empty first render
    try {
      window.sessionStorage.setItem(STORAGE_KEY, JSON.stringify({ step, answers }));
    } catch {
      // Private mode without storage: the questionnaire still works, it just forgets on reload.
    }
  }, [restored, step, answers]);

  // Move focus to the new question when the person moved on or back (not on first paint or a restore), so
  // keyboards and screen readers follow along.
  useEffect(() => {
    if (!stepChangedByPerson.current) return;
    stepChangedByPerson.current = false;
    heading.current?.focus();
  }, [step]);

  const question = CHOICE_QUESTIONS[step];
  const number = step + 1;
  const set = (key: string, value: string) => {
    setSaved((s) => ({ ...s, answers: { ...s.answers, [key]: value } }));
    setErrors((e) => ({ ...e, [key]: '' }));
  };
  const go = (next: number) => {
    stepChangedByPerson.current = true;
    setSaved((s) => ({ ...s, step: Math.min(Math.max(0, next), QUESTION_COUNT - 1) }));
  };

  function next(event: React.FormEvent) {
    event.preventDefault();
    if (question && !answers[question.key]) {
      setErrors({ [question.key]: 'Pick one of the answers to go on (or “Not sure” where there is one).' });
      return;
    }
    setErrors({});
    go(step + 1);
  }

  async function send(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    // The honeypot: people never see it; a form-filling robot does, and its lead is quietly dropped.
    const trap = (event.currentTarget.elements.namedItem('website') as HTMLInputElement | null)?.value || undefined;
    const local: FieldErrors = {};
    if (!answers.name?.trim()) local.name = 'Please tell us your name.';
    if (!answers.email?.trim() && !answers.phone?.trim())
      local.email = 'Give an e-mail address or a phone number so the shop can reach you.';
    if (answers.consent !== 'yes') local.consent = 'Tick the box so the shop may contact you.';
    setErrors(local);
    if (Object.keys(local).length) return;
    setSending(true);
    setProblem(null);
    const payload = {
      ...Object.fromEntries(CHOICE_QUESTIONS.map((q) => [q.key, answers[q.key]])),
      name: answers.name,
      email: answers.email?.trim() || undefined,
      phone: answers.phone?.trim() || undefined,
      consent: true,
      website: trap,
    };
    const { status, body } = await sendJson<{ resultUrl?: string }>('POST', '/api/leads', payload);
    setSending(false);
    if (status === 201 && body.resultUrl) {
      window.sessionStorage.removeItem(STORAGE_KEY);
      router.push(body.resultUrl);
    } else if (status === 422 && body.errors) {
      const fieldErrors = Object.fromEntries(body.errors.map((e) => [e.field, e.message]));
      setErrors(fieldErrors);
      const wrongStep = CHOICE_QUESTIONS.findIndex((q) => fieldErrors[q.key]);
      if (wrongStep >= 0) go(wrongStep);
      setProblem('Something in your answers needs another look.');
    } else if (status === 0) {
      setProblem('We could not reach the shop’s website. Check your connection and try again.');
    } else {
      setProblem(body.message ?? 'That did not go through. Please try again in a moment, or call the shop.');
    }
  }

  return (
    <div className="mx-auto max-w-xl px-4 py-8 text-lg leading-relaxed text-ink">
      <p className="text-base font-semibold text-ink-soft" aria-live="polite">
        Question {number} of {QUESTION_COUNT}
      </p>
      <div className="mt-2 h-3 w-full overflow-hidden rounded-full bg-steel-100" aria-hidden>
        <div className="h-full rounded-full bg-gauge-500" style={{ width: `${(number / QUESTION_COUNT) * 100}%` }} />
      </div>

      {question ? (
        <form onSubmit={next} className="mt-6" noValidate>
          <fieldset aria-describedby={errors[question.key] ? `${question.key}-error` : undefined}>
            <legend className="contents">
              <h1
                ref={heading}
                tabIndex={-1}
                className="text-3xl font-bold leading-tight focus:outline-none sm:text-4xl"
              >
                {question.title}
              </h1>
            </legend>
            {question.help ? <p className="mt-3 text-ink-soft">{question.help}</p> : null}
            <div className="mt-6 flex flex-col gap-3">
              {question.options.map((option) => {
                const checked = answers[question.key] === option.value;
                return (
                  <label
                    key={option.value}
                    className={`flex min-h-14 cursor-pointer items-start gap-4 rounded-lg border-2 px-4 py-3 ${checked ? 'border-ember-500 bg-ember-100' : 'border-steel-300 bg-paper-raised hover:border-steel-500'}`}
                  >
                    <input
                      type="radio"
                      name={question.key}
                      value={option.value}
                      checked={checked}
                      onChange={() => set(question.key, option.value)}
                      className="mt-1 h-6 w-6 shrink-0 accent-ember-600"
                    />
                    <span className="min-w-0">
                      <span className="block text-xl font-semibold">{option.label}</span>
                      {option.hint ? <span className="block text-base text-ink-soft">{option.hint}</span> : null}
                    </span>
                  </label>
                );
              })}
            </div>
          </fieldset>
          {errors[question.key] ? (
            <p id={`${question.key}-error`} role="alert" className="mt-3 font-semibold text-fault-700">
              {errors[question.key]}
            </p>
          ) : null}
          <Nav step={step} onBack={() => go(step - 1)} nextLabel="Next" disabled={!restored} />
        </form>
      ) : (
        <form onSubmit={send} className="mt-6" noValidate>
          <h1 ref={heading} tabIndex={-1} className="text-3xl font-bold leading-tight focus:outline-none sm:text-4xl">
            How can the shop reach you?
          </h1>
          <p className="mt-3 text-ink-soft">
            An e-mail address or a phone number is enough. We use it only to talk to you about this job.
          </p>
          <TextControl
            look="large"
            id="ask-name"
            name="name"
            label="Your name"
            value={answers.name ?? ''}
            error={errors.name}
            onChange={(e) => set('name', e.target.value)}
            autoComplete="name"
            maxLength={LEAD_LIMITS.nameMaxLength}
          />
          <TextControl
            look="large"
            id="ask-email"
            name="email"
            label="E-mail"
            type="email"
            inputMode="email"
            value={answers.email ?? ''}
            error={errors.email}
            onChange={(e) => set('email', e.target.value)}
            autoComplete="email"
            maxLength={LEAD_LIMITS.emailMaxLength}
          />
          <TextControl
            look="large"
            id="ask-phone"
            name="phone"
            label="Phone"
            type="tel"
            inputMode="tel"
            value={answers.phone ?? ''}
            error={errors.phone}
            onChange={(e) => set('phone', e.target.value)}
            autoComplete="tel"
            maxLength={LEAD_LIMITS.phoneMaxLength}
          />
          {/* Not shown, not focusable, not filled by autofill; a robot reading the markup fills it. */}
          <div hidden>
            <label htmlFor="website">Leave this empty</label>
            <input id="website" name="website" type="text" tabIndex={-1} autoComplete="off" defaultValue="" />
          </div>
          <CheckboxControl
            id="ask-consent"
            name="consent"
            look="large"
            label="Yes, the shop may contact me about my answers."
            error={errors.consent}
            checked={answers.consent === 'yes'}
            onChange={(e) => set('consent', e.target.checked ? 'yes' : '')}
          />
          {problem ? (
            <p role="alert" className="mt-4 rounded-lg border-2 border-fault-700 bg-fault-100 p-4 font-semibold">
              {problem}
            </p>
          ) : null}
          <Nav
            step={step}
            onBack={() => go(step - 1)}
            nextLabel={sending ? 'Sending…' : 'See my shortlist'}
            disabled={sending || !restored}
          />
        </form>
      )}
    </div>
  );
}

function Nav({
  step,
  onBack,
  nextLabel,
  disabled,
}: {
  step: number;
  onBack: () => void;
  nextLabel: string;
  disabled?: boolean;
}) {
  return (
    <div className="mt-8 flex flex-wrap-reverse gap-3">
      {step > 0 ? (
        <button type="button" onClick={onBack} className={`${quietButton} flex-1`}>
          Back
        </button>
      ) : null}
      <button type="submit" disabled={disabled} className={`${primaryButton} flex-[2]`}>
        {nextLabel}
      </button>
    </div>
  );
}
