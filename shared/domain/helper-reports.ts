/** What a helper can tell the owners about while covering. */
export const HELPER_REPORT_KINDS = ['escape', 'bite_or_sting', 'death', 'other', 'note'] as const;
export type HelperReportKind = (typeof HELPER_REPORT_KINDS)[number];

export const HELPER_REPORT_WORDS: Record<HelperReportKind, string> = {
  escape: 'An animal got out',
  bite_or_sting: 'Bite, sting or hairs',
  death: 'An animal died',
  other: 'Something else went wrong',
  note: 'A note for the keeper',
};

/** The few words a mail subject uses. */
export const HELPER_REPORT_SUBJECT: Record<HelperReportKind, string> = {
  escape: 'an escape',
  bite_or_sting: 'a bite, sting or hairs',
  death: 'a death',
  other: 'a problem',
  note: 'a note',
};

/**
 * What to do first, shown before the helper sends. Common practice, no published source: it
 * points to local law and licensed medical advice rather than standing in for them.
 */
export const HELPER_REPORT_ADVICE: Record<HelperReportKind, readonly string[]> = {
  escape: [
    'Shut the room’s door and any windows so it stays in one room.',
    'Look along the floor: gaps under doors, behind furniture, skirting and cables.',
    'Set a shallow dish of water on the floor; a loose animal often comes to it.',
    'Do not grab it with bare hands: guide it into a tub with a card or a soft brush.',
  ],
  bite_or_sting: [
    'Wash the spot with soap and water, then hold something cold on it.',
    'Get medical help straight away for swelling that spreads, trouble breathing or any sign of an allergic reaction.',
    'Keep the label code and species name to hand for whoever treats you.',
    'Hairs in the eye: do not rub it; rinse with plenty of clean water and get it checked.',
    'Hairs on skin: lift them off with sticky tape, then rinse.',
    'Local law and a licensed medical professional come before anything here.',
  ],
  death: [
    'Leave the enclosure shut and leave the body where it is unless the keeper asks otherwise.',
    'Take a photo if you can; the keeper may want to see how it was found.',
    'Wash your hands afterwards.',
  ],
  other: [
    'Make things safe first: shut lids and doors, and keep people and pets away.',
    'Say what you saw and what you did; the keeper reads it at once.',
  ],
  note: ['Say which animal and what you noticed; the keeper reads it with the day’s news.'],
};
