import type { RouteRecordRaw } from 'vue-router';

declare module 'vue-router' {
  interface RouteMeta {
    /** Only for a signed-in user. */
    auth?: boolean;
    /** Only for an admin. */
    admin?: boolean;
    /** A page for signed-out visitors (sign in, sign up, reset). */
    guest?: boolean;
    /** A page that needs the whole width (the board): the menu starts closed and opens over it. */
    fullWidth?: boolean;
  }
}

/** One loader for the board's four addresses, so moving between them keeps the page. */
const BoardPage = () => import('../pages/BoardPage.vue');

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    component: () => import('../layouts/MainLayout.vue'),
    children: [
      { path: '', redirect: '/library' },
      { path: 'library', name: 'library', component: () => import('../pages/LibraryPage.vue'), meta: { auth: true } },
      { path: 'sketches/new', name: 'board-new', component: BoardPage, meta: { auth: true, fullWidth: true } },
      { path: 'sketches/:id(\\d+)', name: 'board', component: BoardPage, meta: { auth: true, fullWidth: true } },
      {
        path: 'sketches/:id(\\d+)/sheet',
        name: 'build-sheet',
        component: () => import('../pages/BuildSheetPage.vue'),
        meta: { auth: true },
      },
      // Read-only links work signed out too.
      { path: 'shared/:token', name: 'board-shared', component: BoardPage, meta: { fullWidth: true } },
      {
        path: 'shared/:token/sheet',
        name: 'build-sheet-shared',
        component: () => import('../pages/BuildSheetPage.vue'),
      },
      // A hand-in, read-only: for its class's instructor and for the student who handed it in.
      {
        path: 'hand-ins/:id(\\d+)',
        name: 'board-hand-in',
        component: BoardPage,
        meta: { auth: true, fullWidth: true },
      },
      { path: 'classes', name: 'classes', component: () => import('../pages/ClassesPage.vue'), meta: { auth: true } },
      {
        path: 'classes/:id(\\d+)',
        name: 'class',
        component: () => import('../pages/ClassPage.vue'),
        meta: { auth: true },
      },
      {
        path: 'assignments/:id(\\d+)',
        name: 'assignment',
        component: () => import('../pages/AssignmentPage.vue'),
        meta: { auth: true },
      },
      { path: 'lineup', name: 'lineup', component: () => import('../pages/LineupPage.vue'), meta: { auth: true } },
      { path: 'admin', redirect: '/admin/users' },
      {
        path: 'admin/users',
        name: 'admin-users',
        component: () => import('../pages/AdminUsersPage.vue'),
        meta: { auth: true, admin: true },
      },
      {
        path: 'admin/outbox',
        name: 'admin-outbox',
        component: () => import('../pages/AdminOutboxPage.vue'),
        meta: { auth: true, admin: true },
      },
    ],
  },
  {
    path: '/',
    component: () => import('../layouts/AuthLayout.vue'),
    children: [
      { path: 'signin', name: 'signin', component: () => import('../pages/SignInPage.vue'), meta: { guest: true } },
      { path: 'signup', name: 'signup', component: () => import('../pages/SignUpPage.vue'), meta: { guest: true } },
      {
        path: 'signup/confirm',
        name: 'signup-confirm',
        component: () => import('../pages/SignUpConfirmPage.vue'),
      },
      {
        path: 'forgot',
        name: 'forgot',
        component: () => import('../pages/ForgotPasswordPage.vue'),
        meta: { guest: true },
      },
      { path: 'reset', name: 'reset', component: () => import('../pages/ResetPasswordPage.vue') },
      // An invitation's link works signed out too: it says what it is for, then asks to sign in or sign up.
      { path: 'invites/:token', name: 'invite', component: () => import('../pages/InvitePage.vue') },
    ],
  },
  // Always last: anything else is a page we do not have.
  { path: '/:catchAll(.*)*', name: 'not-found', component: () => import('../pages/NotFoundPage.vue') },
];
