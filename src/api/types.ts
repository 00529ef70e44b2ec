/** Shapes the HTTP API answers with (the server's contract, mirrored for the client). */
import type { Sketch } from '../../shared/schema/sketch';
import type { Role } from '../../shared/schema/accounts';

export type { Role };

export interface User {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export interface SketchSummary {
  id: number;
  name: string;
  layout: string;
  version: number;
  updatedAt: string;
  createdAt: string;
  owner: { id: number; name: string };
  mine: boolean;
  share: 'private' | 'link';
  deletedAt: string | null;
}

export interface SketchDetail extends SketchSummary {
  document: Sketch;
  canEdit: boolean;
  shareToken: string | null;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface Revision {
  rev: number;
  version: number;
  name: string;
  createdAt: string;
}

export interface AdminUser extends User {
  disabled: boolean;
  createdAt: string;
}

export interface OutboxMessage {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string;
  sentAt: string;
}
