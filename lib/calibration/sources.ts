// Where each rule and figure in the worksheets comes from. Results carry these for code, tests,
// docs and API readers; pages never show them (the owner's rule: source notes stay off screen).
// Each names its reference itself; a trade habit with no citable source says so, and a figure
// recalled rather than looked up says "from memory".

export const SOURCES = {
  commonPractice: "common practice, no source",
  ownRule: "our own rule",
  ownRuleByPractice: "our own rule, in line with common practice (no source)",
  uwEhs: "University of Washington EH&S battery guidance",
  bmfa: "BMFA safety guidance",
  vendorsOnly: "vendors only: common practice",
  fromMemory: "from memory; check the cell maker's datasheet",
  divider: "voltage divider Vout = Vin·R2/(R1+R2) (Horowitz & Hill, The Art of Electronics, 3rd ed., §1.2.3, from memory)",
  ohm: "Ohm's law: sensitivity = shunt resistance × amplifier gain; dissipation = I²R",
  adcLsb: "1 LSB = Vref / 2^N (the IEEE Std 1241 form)",
  leastSquares: "ordinary least squares (simple-statistics linearRegression)",
} as const;
