/**
 * Classes: the caller's list of classes, the class and the assignment open on their pages, and every
 * change to them (a class made, renamed, closed, deleted and restored; invitations sent, resent and
 * withdrawn; students removed or leaving; assignments made and published; copies started, hand-ins
 * made, feedback written). The one place the client calls the classes API; answers are read with the
 * shared schemas (shared/schema/classes.ts) and bodies checked with them before they are sent.
 */
import { defineStore } from 'pinia';
import { ref } from 'vue';
import { api } from '../api/http';
import {
  assignmentCopySchema,
  assignmentDetailSchema,
  classDetailSchema,
  classInviteSchema,
  classListSchema,
  createAssignmentBody,
  createClassBody,
  feedbackBody,
  handInDetailSchema,
  handInRowSchema,
  inviteBody,
  invitePreviewSchema,
  inviteResultSchema,
  joinBody,
  joinResultSchema,
  updateAssignmentBody,
  updateClassBody,
  type AssignmentCopy,
  type AssignmentDetail,
  type ClassDetail,
  type ClassInvite,
  type ClassSummary,
  type CreateAssignmentBody,
  type CreateClassBody,
  type HandInDetail,
  type HandInRow,
  type InvitePreview,
  type InviteResult,
  type JoinResult,
  type UpdateAssignmentBody,
  type UpdateClassBody,
} from '../../shared/schema/classes';
import { bodyProblem, readAnswer } from '../classes/answers';
import type { z } from 'zod';

/** The words for each field when a body is refused before it is sent. */
const FIELD_LABELS: Record<string, string> = {
  name: 'Name',
  term: 'Term',
  emails: 'Addresses',
  joinCode: 'Join code',
  sketchId: 'Starter sketch',
  title: 'Title',
  instructions: 'Instructions',
  dueAt: 'Due',
  text: 'Feedback',
};

/** Refuses a body the schema would refuse on the server, with the field named; nothing is sent. */
function checked<T>(schema: z.ZodType, body: T): T {
  const problem = bodyProblem(schema, body, FIELD_LABELS);
  if (problem) throw new Error(problem);
  return body;
}

/** A class as its list row shows it. */
function summaryOf(detail: ClassDetail): ClassSummary {
  const { joinCode: _c, members: _m, invites: _i, assignments: _a, ...summary } = detail;
  return summary;
}

export const useClassesStore = defineStore('classes', () => {
  /** The classes the caller teaches or has joined (deleted ones included while they can be restored). */
  const list = ref<ClassSummary[]>([]);
  const listLoading = ref(false);
  const listError = ref<string | null>(null);

  /** The class on the class page. */
  const current = ref<ClassDetail | null>(null);
  /** The assignment on the assignment page. */
  const assignment = ref<AssignmentDetail | null>(null);
  /** What the last pasted list of addresses came to (sent, refused, skipped), for the class it was sent to. */
  const lastInvites = ref<{ classId: number; result: InviteResult } | null>(null);

  // ---- the list ----

  async function loadList(): Promise<void> {
    listLoading.value = true;
    listError.value = null;
    try {
      list.value = readAnswer(classListSchema, await api.get('/api/classes'), 'your classes').items;
    } catch (err) {
      listError.value = err instanceof Error ? err.message : String(err);
      throw err;
    } finally {
      listLoading.value = false;
    }
  }

  /** A class's new state in the list and on the class page. */
  function apply(detail: ClassDetail): ClassDetail {
    const at = list.value.findIndex((c) => c.id === detail.id);
    if (at >= 0) list.value.splice(at, 1, summaryOf(detail));
    else list.value.unshift(summaryOf(detail));
    if (current.value === null || current.value.id === detail.id) current.value = detail;
    return detail;
  }

  async function create(body: CreateClassBody): Promise<ClassDetail> {
    const sent = checked(createClassBody, {
      name: body.name.trim(),
      ...(body.term?.trim() ? { term: body.term.trim() } : {}),
    });
    const made = readAnswer(classDetailSchema, await api.post('/api/classes', sent), 'the new class');
    list.value = [summaryOf(made), ...list.value.filter((c) => c.id !== made.id)];
    return made;
  }

  // ---- one class ----

  async function loadClass(id: number): Promise<ClassDetail> {
    if (current.value?.id !== id) current.value = null;
    const detail = readAnswer(classDetailSchema, await api.get(`/api/classes/${id}`), 'this class');
    current.value = detail;
    return detail;
  }

  /** Renames, changes the term, closes (read-only, still listed) or reopens a class. */
  async function update(id: number, body: UpdateClassBody): Promise<ClassDetail> {
    checked(updateClassBody, body);
    return apply(readAnswer(classDetailSchema, await api.patch(`/api/classes/${id}`, body), 'the class'));
  }

  /** Deletes a class; it stays restorable (the answer carries `deletedAt`). */
  async function remove(id: number): Promise<ClassDetail> {
    return apply(readAnswer(classDetailSchema, await api.del(`/api/classes/${id}`), 'the deleted class'));
  }

  async function restore(id: number): Promise<ClassDetail> {
    return apply(readAnswer(classDetailSchema, await api.post(`/api/classes/${id}/restore`), 'the restored class'));
  }

  /** The instructor takes a student off the roster; the class is read again for its counts. */
  async function removeMember(classId: number, userId: number): Promise<void> {
    await api.del(`/api/classes/${classId}/members/${userId}`);
    apply(await loadClass(classId));
  }

  /** A student leaves: the class goes from their list (their own copies stay in their library). */
  async function leave(classId: number): Promise<void> {
    await api.post(`/api/classes/${classId}/leave`);
    list.value = list.value.filter((c) => c.id !== classId);
    if (current.value?.id === classId) current.value = null;
  }

  // ---- invitations and joining ----

  /** Sends one invitation per good address of a pasted list; what each address came to is kept in `lastInvites`. */
  async function invite(classId: number, emails: string): Promise<InviteResult> {
    if (!emails.trim()) throw new Error('Addresses: paste at least one e-mail address.');
    const body = checked(inviteBody, { emails });
    const result = readAnswer(
      inviteResultSchema,
      await api.post(`/api/classes/${classId}/invites`, body),
      'the invitations',
    );
    lastInvites.value = { classId, result };
    await loadClass(classId);
    return result;
  }

  function clearInviteResult() {
    lastInvites.value = null;
  }

  /** An invitation's new state on the open class page: a fresh one after a resend, withdrawn when `next` is null. */
  function replaceInvite(classId: number, inviteId: number, next: ClassInvite | null) {
    const c = current.value;
    if (!c || c.id !== classId || !c.invites) return;
    c.invites = next
      ? c.invites.map((i) => (i.id === inviteId ? next : i))
      : c.invites.map((i) => (i.id === inviteId ? { ...i, state: 'withdrawn' as const } : i));
  }

  /** A new link and a new mail; the old link stops working. */
  async function resendInvite(classId: number, inviteId: number) {
    const fresh = readAnswer(
      classInviteSchema,
      await api.post(`/api/classes/${classId}/invites/${inviteId}/resend`),
      'the invitation',
    );
    replaceInvite(classId, inviteId, fresh);
    return fresh;
  }

  /** Withdraws an invitation: its link stops working. */
  async function withdrawInvite(classId: number, inviteId: number): Promise<void> {
    await api.del(`/api/classes/${classId}/invites/${inviteId}`);
    replaceInvite(classId, inviteId, null);
  }

  /** What an invitation's link is for (signed out too). */
  async function previewInvite(token: string): Promise<InvitePreview> {
    return readAnswer(
      invitePreviewSchema,
      await api.get(`/api/invites/${encodeURIComponent(token)}`),
      'the invitation',
    );
  }

  async function acceptInvite(token: string): Promise<JoinResult> {
    const joined = readAnswer(
      joinResultSchema,
      await api.post(`/api/invites/${encodeURIComponent(token)}/accept`),
      'joining the class',
    );
    await loadList().catch(() => undefined);
    return joined;
  }

  async function join(joinCode: string): Promise<JoinResult> {
    const body = checked(joinBody, { joinCode: joinCode.trim() });
    const joined = readAnswer(joinResultSchema, await api.post('/api/classes/join', body), 'joining the class');
    await loadList().catch(() => undefined);
    return joined;
  }

  // ---- assignments ----

  async function createAssignment(classId: number, body: CreateAssignmentBody): Promise<AssignmentDetail> {
    checked(createAssignmentBody, body);
    if (Date.parse(body.dueAt) <= Date.now()) throw new Error('Due: must lie in the future.');
    const made = readAnswer(
      assignmentDetailSchema,
      await api.post(`/api/classes/${classId}/assignments`, body),
      'the new assignment',
    );
    if (current.value?.id === classId) await loadClass(classId);
    return made;
  }

  async function loadAssignment(id: number): Promise<AssignmentDetail> {
    if (assignment.value?.id !== id) assignment.value = null;
    const detail = readAnswer(assignmentDetailSchema, await api.get(`/api/assignments/${id}`), 'this assignment');
    assignment.value = detail;
    return detail;
  }

  /** Changes an assignment: its title, instructions, due date, or whether the class sees every hand-in. */
  async function updateAssignment(id: number, body: UpdateAssignmentBody): Promise<AssignmentDetail> {
    checked(updateAssignmentBody, body);
    const detail = readAnswer(
      assignmentDetailSchema,
      await api.patch(`/api/assignments/${id}`, body),
      'the assignment',
    );
    if (assignment.value?.id === id) assignment.value = detail;
    return detail;
  }

  /** The student's own copy of the starter (made once; asked again, the same copy). */
  async function startCopy(assignmentId: number): Promise<AssignmentCopy> {
    const copy = readAnswer(assignmentCopySchema, await api.post(`/api/assignments/${assignmentId}/copy`), 'your copy');
    if (assignment.value?.id === assignmentId) assignment.value = { ...assignment.value, copy };
    return copy;
  }

  /** Hands in the copy's saved version, frozen; the row comes first in the list. */
  async function handIn(assignmentId: number): Promise<HandInRow> {
    const row = readAnswer(handInRowSchema, await api.post(`/api/assignments/${assignmentId}/hand-ins`), 'the hand-in');
    const a = assignment.value;
    if (a?.id === assignmentId)
      assignment.value = { ...a, handIns: [row, ...a.handIns.filter((h) => h.id !== row.id)] };
    return row;
  }

  /** Writes (or rewrites) the feedback on one hand-in; the server mails it to the student. */
  async function writeFeedback(handInId: number, text: string): Promise<HandInRow> {
    const body = checked(feedbackBody, { text: text.trim() });
    const row = readAnswer(handInRowSchema, await api.post(`/api/hand-ins/${handInId}/feedback`, body), 'the feedback');
    const a = assignment.value;
    if (a) assignment.value = { ...a, handIns: a.handIns.map((h) => (h.id === row.id ? row : h)) };
    return row;
  }

  /** One hand-in with its frozen document (the board and the line-up open it read-only). */
  async function fetchHandIn(id: number): Promise<HandInDetail> {
    return readAnswer(handInDetailSchema, await api.get(`/api/hand-ins/${id}`), 'the hand-in');
  }

  return {
    list,
    listLoading,
    listError,
    current,
    assignment,
    lastInvites,
    loadList,
    create,
    loadClass,
    update,
    remove,
    restore,
    removeMember,
    leave,
    invite,
    clearInviteResult,
    resendInvite,
    withdrawInvite,
    previewInvite,
    acceptInvite,
    join,
    createAssignment,
    loadAssignment,
    updateAssignment,
    startCopy,
    handIn,
    writeFeedback,
    fetchHandIn,
  };
});
