import type { ValveEventSet } from '@/lib/advisor/valve-events';

// A small valve-event diagram: crank degrees across (one full cycle, overlap TDC in the middle), lift
// up. Intake is a solid line, exhaust dashed, so the two differ without colour. The curves' shape is
// a plain smooth bump between the 0.050" events; the open and close points are the card's arithmetic.
const W = 640;
const H = 200;
const PAD = { left: 44, right: 12, top: 16, bottom: 36 };

function bump(openDeg: number, closeDeg: number, lift: number, maxLift: number) {
  const points: string[] = [];
  for (let i = 0; i <= 48; i += 1) {
    const t = i / 48;
    const angle = openDeg + (closeDeg - openDeg) * t;
    const y = lift * Math.sin(Math.PI * t) ** 1.5;
    points.push(`${x(angle).toFixed(1)},${yOf(y, maxLift).toFixed(1)}`);
  }
  return points.join(' ');
}
// Crank degrees 90…630 cover exhaust open to intake close for every grind this shop keeps.
const START = 90;
const END = 630;
const x = (angle: number) => PAD.left + ((angle - START) / (END - START)) * (W - PAD.left - PAD.right);
const yOf = (lift: number, maxLift: number) => H - PAD.bottom - (lift / maxLift) * (H - PAD.top - PAD.bottom);

export function ValveEventDiagram({
  events,
  intakeLiftIn,
  exhaustLiftIn,
}: {
  events: ValveEventSet;
  intakeLiftIn: number;
  exhaustLiftIn: number;
}) {
  const maxLift = Math.max(intakeLiftIn, exhaustLiftIn) * 1.1;
  const exOpen = 180 - events.evo;
  const exClose = 360 + events.evc;
  const inOpen = 360 - events.ivo;
  const inClose = 540 + events.ivc;
  const overlapFrom = Math.min(inOpen, exClose);
  const overlapTo = Math.max(inOpen, exClose);
  const marks = [
    { at: 180, label: 'BDC' },
    { at: 360, label: 'TDC' },
    { at: 540, label: 'BDC' },
  ];
  return (
    <figure className="rounded border border-steel-300 bg-paper-raised p-3">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="valve-diagram-title" className="h-auto w-full">
        <title id="valve-diagram-title">
          {`Valve events: exhaust opens ${events.evo.toFixed(1)}° BBDC and closes ${events.evc.toFixed(1)}° ATDC; intake opens ${events.ivo.toFixed(1)}° BTDC and closes ${events.ivc.toFixed(1)}° ABDC; overlap ${events.overlap.toFixed(1)}°.`}
        </title>
        {events.overlap > 0 ? (
          <rect
            x={x(overlapFrom)}
            y={PAD.top}
            width={Math.max(1, x(overlapTo) - x(overlapFrom))}
            height={H - PAD.top - PAD.bottom}
            className="fill-caution-100"
          />
        ) : null}
        <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} className="stroke-steel-500" />
        {marks.map((m) => (
          <g key={m.at}>
            <line
              x1={x(m.at)}
              x2={x(m.at)}
              y1={PAD.top}
              y2={H - PAD.bottom}
              className="stroke-steel-300"
              strokeDasharray="2 3"
            />
            <text x={x(m.at)} y={H - PAD.bottom + 14} textAnchor="middle" className="fill-ink-muted text-[11px]">
              {m.label}
            </text>
          </g>
        ))}
        <text x={W / 2} y={H - 4} textAnchor="middle" className="fill-ink-muted text-[11px]">
          crank degrees (one cycle, overlap TDC in the middle)
        </text>
        <text x={6} y={PAD.top + 8} className="fill-ink-muted text-[11px]">
          lift
        </text>
        <polyline
          points={bump(exOpen, exClose, exhaustLiftIn, maxLift)}
          fill="none"
          className="stroke-gauge-700"
          strokeWidth={2}
          strokeDasharray="6 4"
        />
        <polyline
          points={bump(inOpen, inClose, intakeLiftIn, maxLift)}
          fill="none"
          className="stroke-ember-600"
          strokeWidth={2}
        />
        {events.overlap > 0 ? (
          <text
            x={(x(overlapFrom) + x(overlapTo)) / 2}
            y={PAD.top + 12}
            textAnchor="middle"
            className="fill-caution-700 text-[11px] font-semibold"
          >
            overlap {events.overlap.toFixed(1)}°
          </text>
        ) : null}
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-xs text-ink-soft">
        <span>
          <svg width="28" height="8" aria-hidden className="mr-1 inline">
            <line x1="0" x2="28" y1="4" y2="4" className="stroke-gauge-700" strokeWidth={2} strokeDasharray="6 4" />
          </svg>
          Exhaust (dashed)
        </span>
        <span>
          <svg width="28" height="8" aria-hidden className="mr-1 inline">
            <line x1="0" x2="28" y1="4" y2="4" className="stroke-ember-600" strokeWidth={2} />
          </svg>
          Intake (solid)
        </span>
        <span>Events at 0.050&quot; tappet lift; the curve shape is drawn for orientation only.</span>
      </figcaption>
    </figure>
  );
}
