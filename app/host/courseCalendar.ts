import type { CoursePlan } from '../../core/courses';
import { courseCaution, courseDrug } from '../../core/courses';
import { citeShort, findSource } from '../../core/references';
import { icsDate, writeIcs, type IcsAllDayEvent, type IcsTimedEvent } from './icalendar';

/** Minutes an event spans on the calendar for each route (slow IV unithiol runs over 20 min: pharmacology chapter); others are instants. */
const infusionMinutesByDrug: Partial<Record<string, number>> = { unithiol: 20 };

function slug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'course';
}

function sourcesText(ids: readonly string[]): string {
  return ids
    .map((id) => {
      const source = findSource(id);
      return source ? citeShort(source) : id;
    })
    .join('; ');
}

/**
 * The events of a planned course: one timed event per administration (its
 * instant in UTC; the ward's clock time in the description) and one all-day
 * event per monitoring date. UIDs are stable for the same label, regimen and
 * start, so a re-export replaces entries rather than doubling them.
 */
export function courseEvents(plan: CoursePlan, label: string): (IcsTimedEvent | IcsAllDayEvent)[] {
  const stem = `${slug(label)}-${plan.regimenId}-${plan.start.localDate.replace(/-/g, '')}${plan.start.localTime.replace(':', '')}`;
  const phaseById = new Map(plan.phases.map((phase) => [`${phase.course}/${phase.id}`, phase]));
  const doses = plan.administrations.map((item): IcsTimedEvent => {
    const phase = phaseById.get(`${item.course}/${item.phaseId}`)!;
    const minutes = infusionMinutesByDrug[item.drug];
    return {
      uid: `${stem}-c${item.course}-${item.phaseId}-${item.number}@chelation-ledger`,
      startUtc: new Date(item.at.epochMs),
      ...(minutes !== undefined ? { durationMinutes: minutes } : {}),
      summary: `${label}: ${courseDrug(item.drug).label} ${Math.round(item.doseMg * 10) / 10} mg ${phase.route} (planned, ${item.number} of ${phase.administrations})`,
      description: [
        `Planned ${item.at.localDate} ${item.at.localTime} (UTC ${item.at.utcOffset}, ${plan.timeZone})${item.clockShifted ? '; after a daylight-saving change' : ''}.`,
        `Course ${item.course}, ${phase.label}; dose as ${phase.dosedAs}: ${phase.doseBasis}${phase.capApplied ? `; ${phase.capApplied}` : ''}.`,
        `Sources: ${sourcesText(phase.sourceIds)}.`,
        courseCaution,
      ].join('\n'),
      categories: ['chelation course', courseDrug(item.drug).label],
    };
  });
  const monitoring = plan.monitoring.map(
    (item, index): IcsAllDayEvent => ({
      uid: `${stem}-monitoring-${index + 1}-${icsDate(item.dueDate)}@chelation-ledger`,
      date: item.dueDate,
      summary: `${label}: ${item.what} due`,
      description: [`${item.what}: due ${item.dueDate} (${plan.title}).`, `Sources: ${sourcesText(item.sourceIds)}.`, courseCaution].join('\n'),
      categories: ['chelation monitoring'],
    }),
  );
  return [...doses, ...monitoring];
}

/**
 * A planned course as .ics text.
 * @param plan - from core/courses planCourse
 * @param label - the patient's code (e.g. PB-2204)
 * @param dtStamp - the instant of writing (the host's clock)
 */
export function courseIcs(plan: CoursePlan, label: string, dtStamp: Date): string {
  return writeIcs({ name: `${label}: ${plan.title} (planned)`, events: courseEvents(plan, label), dtStamp });
}
