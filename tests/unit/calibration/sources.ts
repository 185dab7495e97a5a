// The outside references the worksheet tests check against,
// named once so every test title says where its expected figure comes from.
export const DIVIDER = "voltage divider Vout = Vin·R2/(R1+R2), Horowitz & Hill, The Art of Electronics 3rd ed. §1.2.3 (from memory)";
export const OHM = "Ohm's law: sensitivity = R_shunt × gain, P = I²R";
export const ADC = "1 LSB = Vref / 2^N, IEEE Std 1241 form (from memory)";
export const ANSCOMBE = "Anscombe, 'Graphs in Statistical Analysis', The American Statistician 27(1), 1973";
export const SIMPLE_STATISTICS = "simple-statistics 7.12.1 linearRegression / rSquared (reference npm library)";
export const RECHARGE_RULE = "fly-and-recharge rule (common practice, no source)";
export const ROUNDING_SIDE = "round towards over-reporting (common practice, no source)";
export const LIPO_UW = "University of Washington EH&S battery guidance";
export const LIPO_BMFA = "BMFA safety guidance";
