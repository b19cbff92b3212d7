'use client';

import FullCalendar from '@fullcalendar/react';
import timeGridPlugin from '@fullcalendar/timegrid';
import interactionPlugin from '@fullcalendar/interaction';
import type { EventDropArg } from '@fullcalendar/core';

export interface CalendarSlot {
  id: string;
  title: string;
  subtitle: string;
  cookerIndex: number;
  /** Local wall-clock minutes since midnight. */
  startMin: number;
  endMin: number;
  method: string;
  warn: boolean;
}

/** Day 1 of an arbitrary UTC week: column i of the grid is cooker i (FullCalendar's free time grid has no resource columns). */
const BASE = Date.UTC(2001, 0, 1);
const iso = (cooker: number, minutes: number) => new Date(BASE + cooker * 86_400_000 + minutes * 60_000).toISOString();

/**
 * The plan as a time grid: one column per cooker, one block per batch. Dragging a block to another
 * time or column calls onMove(cookerIndex, startMinutes); the parent asks the server and reverts on refusal.
 */
export default function PlanCalendar({
  cookers,
  slots,
  editable,
  onMove,
}: {
  cookers: string[];
  slots: CalendarSlot[];
  editable: boolean;
  onMove: (slotId: string, cookerIndex: number, startMin: number, revert: () => void) => void;
}) {
  const minMin = Math.max(0, Math.min(6 * 60, ...slots.map((s) => s.startMin)) - 30);
  const maxMin = Math.min(24 * 60, Math.max(19 * 60, ...slots.map((s) => s.endMin)) + 30);
  const hhmm = (m: number) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}:00`;
  return (
    <FullCalendar
      plugins={[timeGridPlugin, interactionPlugin]}
      initialView="cookerGrid"
      views={{ cookerGrid: { type: 'timeGrid', duration: { days: Math.max(1, cookers.length) } } }}
      initialDate={iso(0, 0).slice(0, 10)}
      timeZone="UTC"
      headerToolbar={false}
      allDaySlot={false}
      slotMinTime={hhmm(Math.floor(minMin / 30) * 30)}
      slotMaxTime={hhmm(Math.ceil(maxMin / 30) * 30)}
      slotDuration="00:15:00"
      slotLabelInterval="01:00"
      slotLabelFormat={{ hour: '2-digit', minute: '2-digit', hour12: false }}
      snapDuration="00:15:00"
      height="auto"
      expandRows
      editable={editable}
      eventDurationEditable={false}
      dayHeaderContent={(arg) => {
        const i = Math.round((arg.date.getTime() - BASE) / 86_400_000);
        return <span className="text-sm font-semibold">{cookers[i] ?? ''}</span>;
      }}
      events={slots.map((s) => ({
        id: s.id,
        title: s.title,
        start: iso(s.cookerIndex, s.startMin),
        end: iso(s.cookerIndex, Math.max(s.endMin, s.startMin + 15)),
        classNames: [`method-${s.method}`],
        extendedProps: { subtitle: s.subtitle, warn: s.warn },
      }))}
      eventContent={(arg) => (
        <div className="overflow-hidden px-1 text-xs leading-tight">
          <p className="font-semibold">
            {arg.event.extendedProps.warn ? '⚠ ' : ''}
            {arg.event.title}
          </p>
          <p>{arg.event.extendedProps.subtitle as string}</p>
        </div>
      )}
      eventDrop={(arg: EventDropArg) => {
        const start = arg.event.start!.getTime() - BASE;
        const cookerIndex = Math.floor(start / 86_400_000);
        const startMin = Math.round((start - cookerIndex * 86_400_000) / 60_000);
        onMove(arg.event.id, cookerIndex, startMin, arg.revert);
      }}
    />
  );
}
