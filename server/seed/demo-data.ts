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
  { email: 'jo.marlowe@demo.test', password: 'demo-student-2026', name: 'Jo Marlowe', role: 'member', inClass: true },
  { email: 'kit.ambery@demo.test', password: 'demo-student-2026', name: 'Kit Ambery', role: 'member', inClass: true },
];

/** One invented student's hand-in for the demo assignment: their copy's change from the starter, and when. */
export interface DemoHandIn {
  student: string;
  /** starter parameters that differ in the student's copy (deg) */
  params: Record<string, number>;
  /** days from the due date (negative: before it, so on time; positive: late) */
  daysFromDue: number;
  feedback?: string;
}

/**
 * The demo class's assignment, made from the instructor's demo sketch `starter`. Its due date lies
 * `dueDaysAgo` days before the seed runs, so that one hand-in is on time and the other late.
 */
export const demoAssignment = {
  starter: 'Chassis 210 starter: four-link with lateral rod',
  title: 'Lab 3: bring anti-squat into the band',
  instructions:
    'Copy the starter and move the lower links so that anti-squat at ride lies within the target band, ' +
    'with the pinion angle change at full bump within ±3°. Hand in your copy and add a note in its name.',
  dueDaysAgo: 2,
  handIns: [
    {
      student: 'student@demo.test',
      params: { lowerAngle: 10 },
      daysFromDue: -1,
      feedback:
        'Good move on the lower links. Check the pinion angle change again at full bump: ' +
        'it is close to the edge of the band.',
    },
    { student: 'jo.marlowe@demo.test', params: { lowerAngle: 12, upperAngle: 2 }, daysFromDue: 1 },
  ] as DemoHandIn[],
};
