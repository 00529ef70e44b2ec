import type { Role } from '../models';

/** The invented demo scenario: one fabrication shop and one college chassis class. */
export const demoShop = { name: 'Kettle Creek Fabrication', city: 'Kettle Creek' };

export const demoClass = { name: 'Chassis Design 210', term: 'Autumn 2026' };

export interface DemoAccount {
  email: string;
  password: string;
  name: string;
  role: Role;
  inShop?: boolean;
  inClass?: boolean;
  teachesClass?: boolean;
}

/** Demo sign-ins for local use (printed in README). */
export const demoAccounts: DemoAccount[] = [
  { email: 'admin@demo.test', password: 'demo-admin-2026', name: 'Robin Ashgrove', role: 'admin', inShop: true },
  {
    email: 'instructor@demo.test',
    password: 'demo-instructor-2026',
    name: 'Dana Whitcombe',
    role: 'instructor',
    teachesClass: true,
  },
  { email: 'maker@demo.test', password: 'demo-maker-2026', name: 'Rory Castell', role: 'member', inShop: true },
  { email: 'student@demo.test', password: 'demo-student-2026', name: 'Sam Tillery', role: 'member', inClass: true },
];
