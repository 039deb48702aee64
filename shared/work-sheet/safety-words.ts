/**
 * The safety caution, word for word, for every place that prints it: the page's notice
 * (src/components/SafetyNotice.vue) and the PDF work sheet.
 */
export const SAFETY_TITLE = 'Safety: this is a simulation, real lines are live';

/** The short form, for the work sheet's header. */
export const SAFETY_COMPACT =
  'Working telephone wiring carries talk battery of about 48–52 V DC and ringing of about 90 V AC, which ' +
  "can shock. Disconnect lines before you work, never work during a lightning storm, follow local codes, the carrier's " +
  'rules and licensed practice, and connect only approved equipment to the public network.';

export const SAFETY_INTRO =
  'Leadbench models circuits on screen only. The wiring it helps you plan is not harmless:';

/** The full form's points; `strong` marks the figures the page prints in bold. */
export const SAFETY_POINTS: readonly { text: string; strong?: readonly string[] }[] = [
  {
    text: 'Working lines carry talk battery of about 48–52 V DC, and ringing adds about 90 V AC on top. Both can give you a painful, dangerous shock.',
    strong: ['48–52 V DC', '90 V AC'],
  },
  { text: 'Disconnect the lines at the protector or demarcation point before you touch terminals or leads.' },
  { text: 'Never work on telephone wiring during a lightning storm.' },
  {
    text: "Follow local electrical codes, your carrier's rules and licensed practice where your area requires it.",
  },
  { text: 'Connect only approved equipment to the public telephone network.' },
];
