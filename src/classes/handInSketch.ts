/**
 * A hand-in as the board and the line-up hold a sketch: its frozen document under the record of the copy it
 * came from, owned by the student and never editable. Pure.
 */
import type { SketchDetail } from '../api/types';
import type { HandInDetail } from '../../shared/schema/classes';

export function handInAsSketch(h: HandInDetail): SketchDetail {
  return {
    id: h.sketchId,
    name: h.document.name,
    layout: h.document.layout,
    version: h.version,
    updatedAt: h.handedInAt,
    createdAt: h.handedInAt,
    owner: h.student,
    mine: false,
    share: 'private',
    deletedAt: null,
    document: h.document,
    canEdit: false,
    shareToken: null,
  };
}

/** What the board's banner says of a hand-in open on it. */
export interface HandInOnBoard {
  id: number;
  assignmentId: number;
  assignmentTitle: string;
  studentName: string;
  handedInAt: string;
  late: boolean;
}

export function handInOnBoard(h: HandInDetail): HandInOnBoard {
  return {
    id: h.id,
    assignmentId: h.assignmentId,
    assignmentTitle: h.assignmentTitle,
    studentName: h.student.name,
    handedInAt: h.handedInAt,
    late: h.late,
  };
}
