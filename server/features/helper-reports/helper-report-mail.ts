import { HELPER_REPORT_SUBJECT, HELPER_REPORT_WORDS } from '#shared/domain/helper-reports';
import { clockTime, describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import type { UnsentHelperReport } from './helper-reports.repository';

/** The e-mail an owner gets: who, what, which animal, when (in the collection's zone), and where to read it. */
export function helperReportMail(r: UnsentHelperReport, link: string) {
  const animal = r.animal
    ? `${r.animal.name} (${r.animal.labelCode})`
    : r.animalText || 'No particular animal';
  const when = `${describeLocalDate(localDateOf(r.createdAt, r.timeZone))} at ${clockTime(
    r.createdAt.toISOString(),
    r.timeZone,
  )}`;
  return {
    subject: `${r.collectionName}: ${r.reportedBy} reports ${HELPER_REPORT_SUBJECT[r.kind]}`,
    text: [
      `${r.reportedBy} sent this while covering ${r.collectionName}.`,
      '',
      `What: ${HELPER_REPORT_WORDS[r.kind]}`,
      `Animal: ${animal}`,
      `When: ${when}`,
      '',
      r.note,
      '',
      `Every report is also in the app: ${link}`,
    ].join('\n'),
  };
}
