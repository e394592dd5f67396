import type { InverterDesign } from '@pulsewright/modulation';
import { badRequest } from '../http/errors.js';
import type { Principal } from './principal.js';
import type { StudyDto, StudyService } from './studies.js';

/** The `format` every study record carries, so a file says what it is. */
export const STUDY_RECORD_FORMAT = 'pulsewright-study-record';

/**
 * The record format this service writes and reads. Raise it (and teach `importRecord` to read
 * the older ones) when a record's shape changes; a record of a newer version is refused.
 */
export const STUDY_RECORD_VERSION = 1;

/**
 * A study as a JSON document a team can keep under version control or move to another
 * installation: the study's content at its current revision (name, note, the `InverterDesign`)
 * and where it came from, with nothing that ties it to this installation (no ids, no project, no
 * author). The same record gives the same text: keys in a fixed order, no export time.
 */
export interface StudyRecord {
  format: typeof STUDY_RECORD_FORMAT;
  formatVersion: number;
  name: string;
  note: string;
  design: InverterDesign;
  /** The revision the record was taken from, and when that revision was saved. */
  source: { revision: number; savedAt: string; serviceVersion: string };
}

/** The record of a study at its current revision. */
export function studyRecordOf(study: StudyDto, serviceVersion: string): StudyRecord {
  return {
    format: STUDY_RECORD_FORMAT,
    formatVersion: STUDY_RECORD_VERSION,
    name: study.name,
    note: study.note,
    design: study.design,
    source: { revision: study.revision, savedAt: study.updatedAt, serviceVersion },
  };
}

/**
 * Refuses a record of a newer format version than this service reads (400 naming
 * `formatVersion`). The rest of the record has been checked against the StudyRecord schema by
 * the request validator, with the same schema and messages as a new study's design.
 */
export function assertRecordVersion(record: Pick<StudyRecord, 'formatVersion'>): void {
  if (record.formatVersion > STUDY_RECORD_VERSION) {
    const message = `formatVersion ${record.formatVersion} is newer than this service reads (${STUDY_RECORD_VERSION}): import the record into an installation of the same or a later version, or export it again from an older one`;
    throw badRequest(message, [{ path: 'formatVersion', message }]);
  }
}

/** A new study (revision 1) in `projectId` from a record whose design has been checked. */
export function importRecord(
  studies: StudyService,
  principal: Principal,
  projectId: string,
  record: StudyRecord,
): Promise<StudyDto> {
  return studies.create(principal, projectId, {
    name: record.name,
    design: record.design,
    note: record.note,
  });
}
