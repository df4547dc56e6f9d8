/** The consultancy as it signs its quotes: one place for the letterhead of the PDF and the e-mail. */
export const FIRM = {
  name: 'Railwright',
  line: 'Design of DC supply rails',
  address: ['Unit 4, Weir Mill Yard', 'Brookford BF2 7QL'],
  email: 'quotes@railwright.test',
} as const;
