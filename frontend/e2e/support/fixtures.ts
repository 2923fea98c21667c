/** A 15 ft wide, 62,000 lb excavator on the lower deck of the default step deck: the article several specs move. */
export const wideExcavatorArticle = () => ({
  id: 'A1', description: 'Tracked excavator, boom folded', lengthIn: 384, widthIn: 180, heightIn: 126, weightLb: 62_000, weightSource: 'spec_sheet',
  positionFromTrailerFrontIn: 150, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: false, heavyEquipment: true, sharpEdges: true,
  tiedowns: [1, 2, 3, 4].map((n) => ({ label: `chain ${n}`, kind: 'chain', chainSize: '1/2', chainGrade: 70, anchorKind: 'winch_track', path: 'direct', edgeProtection: true })),
});
