/**
 * Every screen the accessibility check visits, as data: a name, who looks at it, and how to get there.
 * A new screen is one more line in SCREENS (see DEVELOPERS.md, "Checking accessibility").
 */
import { expect, type Page } from '@playwright/test';
import { $ } from './board';

/** Who is signed in: nobody, the demo maker (a member), the demo admin, the demo instructor or a demo student. */
export type Viewer = 'guest' | 'maker' | 'admin' | 'instructor' | 'student';

/**
 * What the spec makes or looks up once before the screens are visited: sketches of the maker's, a read-only link,
 * the demo class with its assignment, and an invitation to it.
 */
export interface Made {
  /** a sketch of the maker's for each starter the screens show, by layout */
  sketch: Record<BoardLayout, number>;
  /** the read-only link's token of the four-link sketch */
  sharedToken: string;
  /** the demo class (the instructor teaches it, the demo student is in it) */
  classId: number;
  /** the demo class's assignment ("Lab 3", handed in by the demo student) */
  assignmentId: number;
  /** the path of an invitation to the demo class, from its mail */
  invitePath: string;
}

/** One layout of each family the board draws differently: solid axles, wishbones, trailing arms and leaf springs. */
export const BOARD_LAYOUTS = [
  'four-link-lateral-rod',
  'steered-front-axle',
  'double-wishbone',
  'trailing-arm',
  'leaf-spring',
] as const;
export type BoardLayout = (typeof BOARD_LAYOUTS)[number];

export interface Screen {
  name: string;
  as: Viewer;
  /** a phone's screen instead of a desktop's */
  phone?: boolean;
  /** Goes to the screen and waits until it shows what is to be checked. */
  open: (page: Page, made: Made) => Promise<void>;
}

export const PHONE = { width: 390, height: 844 };

/** A sweep with steer rows takes a while on a busy machine. */
const SWEEP_WAIT = { timeout: 45_000 };

/** Waits until the board has swept its sketch and drawn its plots. */
async function boardShown(page: Page): Promise<void> {
  await expect($(page, 'readout-position')).toHaveText('at ride height', SWEEP_WAIT);
  await expect($(page, 'board-plots').locator('canvas').first()).toBeVisible();
}

async function board(page: Page, made: Made, layout: BoardLayout): Promise<void> {
  await page.goto(`/sketches/${made.sketch[layout]}`);
  await boardShown(page);
}

/** The board with its plan view in the cross pane (layouts that steer). */
async function boardPlan(page: Page, made: Made, layout: BoardLayout): Promise<void> {
  await board(page, made, layout);
  await $(page, 'tab-plan').click();
  await expect($(page, 'canvas-plan')).toBeVisible();
}

async function library(page: Page): Promise<void> {
  await page.goto('/library');
  await expect(page.getByTestId('library-table').locator('tbody tr').first()).toBeVisible();
}

export const SCREENS: Screen[] = [
  {
    name: 'sign-in',
    as: 'guest',
    open: async (page) => {
      await page.goto('/signin');
      await expect($(page, 'submit')).toBeVisible();
    },
  },
  {
    name: 'sign-up',
    as: 'guest',
    open: async (page) => {
      await page.goto('/signup');
      await expect($(page, 'submit')).toBeVisible();
    },
  },
  {
    name: 'forgot password',
    as: 'guest',
    open: async (page) => {
      await page.goto('/forgot');
      await expect($(page, 'submit')).toBeVisible();
    },
  },
  {
    name: 'reset password',
    as: 'guest',
    open: async (page) => {
      await page.goto('/reset?token=a-token-from-the-e-mail');
      await expect($(page, 'submit')).toBeVisible();
    },
  },
  { name: 'library', as: 'maker', open: library },
  { name: 'library on a phone', as: 'maker', phone: true, open: library },
  {
    name: 'new sketch dialog',
    as: 'maker',
    open: async (page) => {
      await library(page);
      await $(page, 'new-sketch').first().click();
      await expect($(page, 'starter-create')).toBeEnabled();
    },
  },
  ...BOARD_LAYOUTS.map((layout) => ({
    name: `board: ${layout}`,
    as: 'maker' as const,
    open: (page: Page, made: Made) => board(page, made, layout),
  })),
  { name: 'board: plan view', as: 'maker', open: (page, made) => boardPlan(page, made, 'double-wishbone') },
  {
    name: 'board: steered axle plan view',
    as: 'maker',
    open: (page, made) => boardPlan(page, made, 'steered-front-axle'),
  },
  {
    name: 'board on a phone',
    as: 'maker',
    phone: true,
    open: (page, made) => board(page, made, 'double-wishbone'),
  },
  {
    name: 'share dialog',
    as: 'maker',
    open: async (page, made) => {
      await board(page, made, 'four-link-lateral-rod');
      await $(page, 'board-menu').click();
      await $(page, 'open-share').click();
      await expect($(page, 'share-status')).toContainText('A read-only link is live.');
    },
  },
  {
    name: 'build sheet',
    as: 'maker',
    open: async (page, made) => {
      await page.goto(`/sketches/${made.sketch['four-link-lateral-rod']}/sheet`);
      await expect($(page, 'sheet-geometry')).toBeVisible();
    },
  },
  {
    name: 'line-up',
    as: 'maker',
    open: async (page, made) => {
      await page.goto(`/lineup?ids=${made.sketch['four-link-lateral-rod']},${made.sketch['leaf-spring']}`);
      await expect($(page, 'lineup-brackets-summary')).toBeVisible();
      await expect($(page, 'lineup-side').locator('canvas').first()).toBeVisible();
    },
  },
  {
    name: 'shared board',
    as: 'guest',
    open: async (page, made) => {
      await page.goto(`/shared/${made.sharedToken}`);
      await expect($(page, 'readonly-banner')).toBeVisible();
      await boardShown(page);
    },
  },
  {
    name: 'shared build sheet',
    as: 'guest',
    open: async (page, made) => {
      await page.goto(`/shared/${made.sharedToken}/sheet`);
      await expect($(page, 'sheet-geometry')).toBeVisible();
    },
  },
  {
    name: 'admin users',
    as: 'admin',
    open: async (page) => {
      await page.goto('/admin/users');
      await expect(page.getByTestId('users-table')).toContainText('student@demo.test');
    },
  },
  {
    name: 'admin outbox',
    as: 'admin',
    open: async (page) => {
      await page.goto('/admin/outbox');
      await expect(page.getByTestId('outbox-table')).toBeVisible();
    },
  },
  {
    name: 'classes',
    as: 'instructor',
    open: async (page) => {
      await page.goto('/classes');
      await expect($(page, 'classes-teaching')).toContainText('Chassis Design 210');
    },
  },
  {
    name: 'classes of a student',
    as: 'student',
    open: async (page) => {
      await page.goto('/classes');
      await expect($(page, 'classes-joined')).toContainText('Chassis Design 210');
    },
  },
  {
    name: 'a class',
    as: 'instructor',
    open: async (page, made) => {
      await page.goto(`/classes/${made.classId}`);
      await expect($(page, 'join-code-shown')).toBeVisible();
      await expect($(page, 'assignments')).toContainText('Lab 3');
    },
  },
  {
    name: 'an assignment, as its instructor',
    as: 'instructor',
    open: async (page, made) => {
      await page.goto(`/assignments/${made.assignmentId}`);
      await expect($(page, 'hand-ins-table').locator('tbody tr').first()).toBeVisible();
    },
  },
  {
    name: 'an assignment, as a student',
    as: 'student',
    open: async (page, made) => {
      await page.goto(`/assignments/${made.assignmentId}`);
      await expect($(page, 'my-copy')).toBeVisible();
      await expect($(page, 'my-feedback')).toBeVisible();
    },
  },
  {
    name: 'invitation, signed out',
    as: 'guest',
    open: async (page, made) => {
      await page.goto(made.invitePath);
      await expect($(page, 'invite-class')).toHaveText('Chassis Design 210');
      await expect($(page, 'invite-signin')).toBeVisible();
    },
  },
  {
    name: 'not found',
    as: 'maker',
    open: async (page) => {
      await page.goto('/no-such-page');
      await expect(page.getByText('Nothing here')).toBeVisible();
    },
  },
];
