import type { LeadAnswers } from '@/lib/schemas/lead';

// The questionnaire's questions in plain words, one screen each. The staff leads page reads the same
// labels, so the shop sees exactly what the customer picked.
export type ChoiceKey =
  'engine' | 'vehicle' | 'use' | 'idle' | 'emissions' | 'transmission' | 'driveline' | 'exhaust' | 'budget';
export type ChoiceQuestion = {
  key: ChoiceKey;
  title: string;
  help?: string;
  options: { value: string; label: string; hint?: string }[];
};

export const CHOICE_QUESTIONS: readonly ChoiceQuestion[] = [
  {
    key: 'engine',
    title: 'Which engine is it?',
    help: 'The size is usually on a badge, on the engine cover or in the paperwork, in litres.',
    options: [
      { value: '4.8', label: '4.8 litre' },
      { value: '5.3', label: '5.3 litre' },
      { value: '5.7', label: '5.7 litre' },
      { value: '6.0', label: '6.0 litre' },
      { value: '6.2', label: '6.2 litre' },
      { value: 'unsure', label: 'Not sure', hint: 'We will assume the most common one and check with you.' },
    ],
  },
  {
    key: 'vehicle',
    title: 'What kind of vehicle is it?',
    help: 'Getting at the cam is more work in some vehicles than others, so the price of fitting it depends on this.',
    options: [
      { value: 'truck', label: 'Pickup truck' },
      { value: 'suv', label: 'SUV', hint: 'A sport utility vehicle.' },
      { value: 'van', label: 'Van' },
      { value: 'car', label: 'Car', hint: 'A coupe, sedan or convertible.' },
    ],
  },
  {
    key: 'use',
    title: 'What do you mostly use it for?',
    options: [
      { value: 'daily', label: 'Everyday driving', hint: 'Commuting, errands.' },
      { value: 'towing', label: 'Towing or hauling', hint: 'A trailer, a boat, heavy loads.' },
      { value: 'street', label: 'Fun on the street', hint: 'Weekends and shows, still driven on the road.' },
      { value: 'strip', label: 'Mostly the race track', hint: 'Drag strip or track days.' },
    ],
  },
  {
    key: 'idle',
    title: 'How should it sound when it is standing still?',
    help: 'A bigger cam makes the engine lope at idle: that choppy sound some people love. It also makes it a little less calm in traffic.',
    options: [
      { value: 'smooth', label: 'Smooth and quiet, like now' },
      { value: 'noticeable', label: 'A little lope you can hear' },
      { value: 'aggressive', label: 'A big, choppy lope' },
    ],
  },
  {
    key: 'emissions',
    title: 'Does it have to pass an emissions test?',
    help: 'Some places test road vehicles for exhaust pollution. If it does, only certified parts may be allowed.',
    options: [
      { value: 'yes', label: 'Yes' },
      { value: 'no', label: 'No' },
      { value: 'unsure', label: 'Not sure', hint: 'We will treat it as a yes to be safe.' },
    ],
  },
  {
    key: 'transmission',
    title: 'Automatic or manual?',
    options: [
      { value: 'automatic', label: 'Automatic', hint: 'No clutch pedal.' },
      { value: 'manual', label: 'Manual', hint: 'Clutch pedal and a gear stick.' },
    ],
  },
  {
    key: 'driveline',
    title: 'Have the converter or gears been changed?',
    help: 'The converter sits between an automatic gearbox and the engine; the gears in the rear axle set how fast the engine turns at a given speed.',
    options: [
      { value: 'stock', label: 'No, both as they came from the factory' },
      { value: 'converter', label: 'The converter was changed' },
      { value: 'gears', label: 'The axle gears were changed' },
      { value: 'both', label: 'Both were changed' },
      { value: 'unsure', label: 'Not sure' },
    ],
  },
  {
    key: 'exhaust',
    title: 'What exhaust does it have?',
    options: [
      { value: 'stock', label: 'Stock', hint: 'As it came from the factory.' },
      {
        value: 'headers',
        label: 'Headers',
        hint: 'Aftermarket tube pipes off the engine, with a full exhaust after them.',
      },
      { value: 'open', label: 'Open', hint: 'Short pipes or no mufflers.' },
    ],
  },
  {
    key: 'budget',
    title: 'Roughly what would you like to spend, parts and work together?',
    options: [
      { value: 'under-1500', label: 'Under $1,500' },
      { value: '1500-3000', label: '$1,500 to $3,000' },
      { value: '3000-5000', label: '$3,000 to $5,000' },
      { value: 'over-5000', label: 'More than $5,000' },
      { value: 'unsure', label: 'Not sure yet' },
    ],
  },
];

/** The choice questions plus the contact screen. */
export const QUESTION_COUNT = CHOICE_QUESTIONS.length + 1;

/** The label the customer saw for an answer, e.g. engine "5.3" → "5.3 litre". */
export function answerLabel(key: ChoiceKey, value: string): string {
  const question = CHOICE_QUESTIONS.find((q) => q.key === key);
  return question?.options.find((o) => o.value === value)?.label ?? value;
}

/** Every answer as question → plain answer, for the staff page and the shop's e-mail. */
export function answersInWords(answers: Partial<LeadAnswers>): { question: string; answer: string }[] {
  return CHOICE_QUESTIONS.map((q) => {
    const value = answers[q.key];
    return { question: q.title, answer: typeof value === 'string' ? answerLabel(q.key, value) : 'not answered' };
  });
}
