#!/usr/bin/env python3
"""Writes units.jsonl: the phrasing corpus of units@2, each expected answer computed here.

Run from this folder with Python 3.11 (standard library only):  python3 units_references.py
The build does not run this script; UnitsPhrasingsTest reads the file it writes.

Every expected value is computed with exact fractions from the published definitions named in
the case's "reference" (NIST SP 811 Appendix B.8, NIST Handbook 44 Appendix C, the 1959
international yard and pound agreement, the UK Weights and Measures Act 1985, the SI Brochure),
independently of the Java code; only pi (for angles) is a decimal, computed here by Machin's
formula to 60 digits. Results are rounded half-even to 6 significant digits and written by the
contract's number rules (plain notation for 1e-6 <= |x| < 1e21, trailing zeros trimmed).
"""
import json
from decimal import Decimal, getcontext, ROUND_HALF_EVEN, ROUND_FLOOR
from fractions import Fraction as Fr

getcontext().prec = 80

# ---- definitions (exact) ------------------------------------------------------------------------
M = Fr(1)
INCH = Fr(254, 10000)            # 1959 agreement: 1 in = 0.0254 m
FT = 12 * INCH
YD = 3 * FT
MI = 5280 * FT                   # international mile
CM = Fr(1, 100); MM = Fr(1, 1000); KM = Fr(1000)
NMI = Fr(1852)                   # SP 811 B.8
KG = Fr(1); G = Fr(1, 1000)
LB = Fr(45359237, 10**8)         # 1959 agreement
OZ = LB / 16
ST = 14 * LB                     # Weights and Measures Act 1985, Schedule 1
L = Fr(1, 1000); ML = L / 1000
GAL_US = 231 * INCH**3           # NIST Handbook 44 Appendix C: 231 in^3
QT_US = GAL_US / 4; PT_US = GAL_US / 8; CUP_US = GAL_US / 16
FLOZ_US = GAL_US / 128; TBSP_US = FLOZ_US / 2; TSP_US = FLOZ_US / 6
GAL_IMP = Fr(454609, 100000) * L # Weights and Measures Act 1985: 4.546 09 L
QT_IMP = GAL_IMP / 4; PT_IMP = GAL_IMP / 8; FLOZ_IMP = GAL_IMP / 160; CUP_IMP = 10 * FLOZ_IMP
CUP_METRIC = 250 * ML; TBSP_METRIC = 15 * ML; TSP_METRIC = 5 * ML; PT_METRIC = 500 * ML
S = Fr(1); MIN = 60 * S; H = 3600 * S; DAY = 86400 * S
J = Fr(1); KJ = 1000 * J; MJ = 10**6 * J
CAL_TH = Fr(4184, 1000)          # SP 811 B.8: calorie (thermochemical) = 4.184 J
KCAL_TH = 1000 * CAL_TH
CAL_IT = Fr(41868, 10000)        # SP 811 B.8: calorie (IT) = 4.1868 J
BTU_IT = CAL_IT * Fr(5, 9) * (LB / G)   # SP 811 B.8: Btu_IT = 1055.056 J (1 Btu/lb = 1 cal/g x 5/9)
KWH = 3600 * 1000 * J
W = Fr(1); KW = 1000 * W
GN = Fr(980665, 100000)          # SP 811 B.8: standard acceleration of gravity
LBF = LB * GN
HP_MECH = 550 * FT * LBF         # SP 811 B.8: horsepower (550 ft lbf/s)
HP_METRIC = 75 * GN              # SP 811 B.8: horsepower (metric) = 75 kgf m/s
PA = Fr(1); KPA = 1000 * PA; ATM = 101325 * PA; PSI = LBF / INCH**2; BAR = 100000 * PA
M2 = Fr(1); ACRE = 43560 * FT**2; HA = 10000 * M2
M3 = Fr(1); CC = Fr(1, 10**6)
MPH = MI / H; KMH = KM / H; KNOT = NMI / H
PT_DTP = INCH / 72; PX = INCH / 96


def getpi(digits=70):
    getcontext().prec = digits + 10
    def atan_inv(x):
        x = Decimal(x); x2 = x * x; term = 1 / x; total = term; n = 1; sign = -1
        while True:
            term /= x2
            t = term / (2 * n + 1)
            if t == 0 or abs(t) < Decimal(10) ** -(digits + 5):
                break
            total += sign * t; sign = -sign; n += 1
        return total
    p = 16 * atan_inv(5) - 4 * atan_inv(239)
    getcontext().prec = 80
    return p

PI = getpi()
DEG = Fr(1)                      # angles in degrees below; radians via PI
ARCMIN = Fr(1, 60); ARCSEC = Fr(1, 3600)


# ---- the contract's number rules ------------------------------------------------------------------
def to_decimal(x):
    if isinstance(x, Fr):
        return Decimal(x.numerator) / Decimal(x.denominator)
    return Decimal(x)


def round_sig(x, digits=6):
    d = to_decimal(x)
    if d == 0:
        return Decimal(0)
    exp = d.adjusted()
    return d.quantize(Decimal(1).scaleb(exp - digits + 1), rounding=ROUND_HALF_EVEN)


def fmt(d):
    if d == 0:
        return "0"
    d = d.normalize()
    a = abs(d)
    if Decimal("1e-6") <= a < Decimal("1e21"):
        s = format(d, "f")
        return s
    digits = str(abs(d.as_tuple().digits and int("".join(map(str, d.as_tuple().digits)))))
    exp = d.adjusted()
    mant = digits[0] + ("." + digits[1:] if len(digits) > 1 else "")
    return ("-" if d < 0 else "") + mant + "e" + ("+" if exp >= 0 else "-") + str(abs(exp))


def num(x, digits=6):
    return fmt(round_sig(x, digits))


def parts(x, sizes, digits=6):
    """x in the last unit; sizes: each unit's size in the last unit, largest first (the last is 1)."""
    x = Fr(x)
    neg = x < 0
    rest = -x if neg else x
    whole = []
    for size in sizes[:-1]:
        q = rest // size
        whole.append(int(q))
        rest = rest - q * size
    last = round_sig(rest, digits)
    if len(sizes) > 1 and last >= sizes[-2]:       # rounded up to a whole larger unit: carry
        last -= sizes[-2]
        whole[-1] += 1
        for i in range(len(whole) - 1, 0, -1):
            if whole[i] >= sizes[i - 1] // sizes[i]:
                whole[i] -= sizes[i - 1] // sizes[i]
                whole[i - 1] += 1
    if neg:  # every part that is not zero is negative, so that the parts add up to the value
        whole = [-w for w in whole]
        last = -last
    return "", [str(w) for w in whole] + [fmt(last)]


cases = []


def ok(text, value, unit, ref, args=None, digits=6):
    c = {"text": text}
    if args:
        c["args"] = args
    c["expect"] = num(value, digits) + " " + unit
    c["reference"] = ref
    cases.append(c)


def mixed(text, value, units, sizes, ref, args=None):
    sign, out = parts(value, sizes)
    c = {"text": text}
    if args:
        c["args"] = args
    c["expect"] = sign + " ".join(f"{n} {u}" for n, u in zip(out, units))
    c["reference"] = ref
    cases.append(c)


def refuse(text, code, ref, readings=None, args=None):
    c = {"text": text}
    if args:
        c["args"] = args
    c["refuse"] = code
    if readings:
        c["readings"] = readings
    c["reference"] = ref
    cases.append(c)


HB44 = "NIST Handbook 44 App. C (US gallon 231 in^3; cup 1/16, fl oz 1/128 gallon; tbsp 1/2, tsp 1/6 fl oz); 1959 inch"
WMA = "UK Weights and Measures Act 1985, Sch. 1 (gallon 4.546 09 L; pint 1/8 gallon; fl oz 1/160 gallon)"
IN59 = "1959 yard and pound agreement (1 in = 0.0254 m, 1 lb = 0.453 592 37 kg)"
SP811_TH = "NIST SP 811 B.8 (calorie_th = 4.184 J; kilocalorie_th = 4184 J)"
SP811_HP = "NIST SP 811 B.8 (horsepower = 550 ft lbf/s; lbf = lb x 9.806 65 m/s^2)"
SP811_BTU = "NIST SP 811 B.8 (Btu_IT: 1 Btu/lb = 1 cal_IT/g x 5/9; cal_IT = 4.1868 J)"
SP811_F = "NIST SP 811 B.9 (t/degC = (t/degF - 32)/1.8; T/K = t/degC + 273.15)"
SI = "SI Brochure, 9th ed. (prefixes, Table 7; minute, hour, day, litre, hectare, Table 8)"
MEM = "from memory"

# ---- kitchen measures by default reading (system us) ----------------------------------------------
ok("3 cups to ml", 3 * CUP_US / ML, "ml", HB44)
ok("2 tbsp to ml", 2 * TBSP_US / ML, "ml", HB44)
ok("1 tsp in ml", TSP_US / ML, "ml", HB44)
ok("8 fl oz to ml", 8 * FLOZ_US / ML, "ml", HB44)
ok("1 pint to ml", PT_US / ML, "ml", HB44 + "; liquid pint 1/8 gallon")
ok("1 quart to liters", QT_US / L, "liters", HB44 + "; liquid quart 1/4 gallon")
ok("1 gallon to liters", GAL_US / L, "liters", HB44)
ok("5 gallons to liters", 5 * GAL_US / L, "liters", HB44)
ok("2 cups to fl oz", 2 * CUP_US / FLOZ_US, "fl oz", HB44)
ok("1 cup in tablespoons", CUP_US / TBSP_US, "tablespoons", HB44 + "; NIST SP 430: 1 cup = 16 tablespoons")
ok("how many tablespoons in a cup", CUP_US / TBSP_US, "tablespoons", HB44 + "; NIST SP 430: 1 cup = 16 tablespoons")
ok("how many teaspoons in a tablespoon", TBSP_US / TSP_US, "teaspoons", HB44 + "; NIST SP 430: 1 tablespoon = 3 teaspoons")
ok("how many cups in a gallon", GAL_US / CUP_US, "cups", HB44)
ok("how many ml in a cup", CUP_US / ML, "ml", HB44)
ok("How many mL in one cup?", CUP_US / ML, "mL", HB44)
ok("how many cups are in a quart", QT_US / CUP_US, "cups", HB44)
ok("how many ounces in a cup", CUP_US / FLOZ_US, "ounces", HB44 + "; oz beside a volume is the fluid ounce")
ok("16 oz to cups", 16 * FLOZ_US / CUP_US, "cups", HB44 + "; oz beside a volume is the fluid ounce")
ok("8 oz to ml", 8 * FLOZ_US / ML, "ml", HB44 + "; oz beside a volume is the fluid ounce")
ok("250 ml to cups", 250 * ML / CUP_US, "cups", HB44)
ok("500 mL in cups", 500 * ML / CUP_US, "cups", HB44)
ok("1 L to cups", L / CUP_US, "cups", HB44)
ok("16 fl oz to cups", 16 * FLOZ_US / CUP_US, "cups", HB44)
ok("1 liter to gallons", L / GAL_US, "gallons", HB44)
ok("2 Tbsp to tsp", 2 * TBSP_US / TSP_US, "tsp", HB44)
ok("1 TBSP to ml", TBSP_US / ML, "ml", HB44 + "; TBSP read as tbsp")
ok("1 pt to ml", PT_US / ML, "ml", HB44 + "; pt beside a volume is the pint")
ok("2 pts to cups", 2 * PT_US / CUP_US, "cups", HB44)
ok("2 cups of milk to ml", 2 * CUP_US / ML, "ml", HB44)
ok("1 fl. oz. to ml", FLOZ_US / ML, "ml", HB44)
# ---- the same names under another system ---------------------------------------------------------
ok("1 cup to ml", CUP_IMP / ML, "ml", WMA + "; imperial cup = 10 fl oz (" + MEM + ")", {"system": "imperial"})
ok("1 pint in ml", PT_IMP / ML, "ml", WMA, {"system": "imperial"})
ok("1 gallon to L", GAL_IMP / L, "L", WMA, {"system": "imperial"})
ok("1 fl oz to ml", FLOZ_IMP / ML, "ml", WMA, {"system": "imperial"})
ok("2 quarts to litres", 2 * QT_IMP / L, "litres", WMA + "; quart 1/4 gallon", {"system": "imperial"})
ok("1 cup to ml", CUP_METRIC / ML, "ml", "metric cup 250 mL (" + MEM + ")", {"system": "metric"})
ok("2 tbsp to ml", 2 * TBSP_METRIC / ML, "ml", "metric tablespoon 15 mL (" + MEM + ")", {"system": "metric"})
ok("1 tsp to ml", TSP_METRIC / ML, "ml", "metric teaspoon 5 mL (" + MEM + ")", {"system": "metric"})
ok("1 hp in watts", HP_METRIC, "watts", "NIST SP 811 B.8 (horsepower, metric = 75 kgf m/s)", {"system": "metric"})
ok("30 mpg to L/100km", 100 * KM / (30 * MI / GAL_IMP) / L, "L/100km", WMA + "; mile 5280 ft (" + IN59 + ")",
   {"system": "imperial"})
# ---- energy and power ----------------------------------------------------------------------------
ok("2000 kcal in kJ", 2000 * KCAL_TH / KJ, "kJ", SP811_TH)
ok("1 kcal to kJ", KCAL_TH / KJ, "kJ", SP811_TH)
ok("500 Cal to kJ", 500 * KCAL_TH / KJ, "kJ", SP811_TH + "; Cal is the food Calorie (kilocalorie)")
ok("1 kilocalorie to joules", KCAL_TH / J, "joules", SP811_TH)
ok("250 kcal to kWh", 250 * KCAL_TH / KWH, "kWh", SP811_TH + "; kWh = 3.6 MJ (SI Brochure, Table 8)")
ok("1 hp in watts", HP_MECH, "watts", SP811_HP + "; " + IN59)
ok("150 hp to kW", 150 * HP_MECH / KW, "kW", SP811_HP + "; " + IN59)
ok("100 kW to hp", 100 * KW / HP_MECH, "hp", SP811_HP + "; " + IN59)
ok("2 HP to kW", 2 * HP_MECH / KW, "kW", SP811_HP + "; HP read as hp")
ok("1 BTU to J", BTU_IT, "J", SP811_BTU)
ok("1 kWh to BTU", KWH / BTU_IT, "BTU", SP811_BTU)
ok("10000 BTU/h to W", 10000 * BTU_IT / H, "W", SP811_BTU)
ok("1 MMBtu to kWh", 10**6 * BTU_IT / KWH, "kWh", SP811_BTU + "; MMBtu = 10^6 Btu (" + MEM + ")")
ok("1 kWh to MJ", KWH / MJ, "MJ", "NIST SP 811 B.8 (watt hour = 3.6 E+03 J, exact)")
ok("1 KWH to MJ", KWH / MJ, "MJ", "NIST SP 811 B.8 (watt hour = 3.6 E+03 J); KWH read as kWh")
# ---- temperatures, bare F and C ------------------------------------------------------------------
def f_to_c(f): return (f - 32) * Fr(5, 9)
def c_to_f(c): return c * Fr(9, 5) + 32
ok("98.6 F to C", f_to_c(Fr("98.6")), "C", SP811_F)
ok("100 C to F", c_to_f(100), "F", SP811_F)
ok("-40 F to C", f_to_c(-40), "C", SP811_F)
ok("0 C to K", Fr("273.15"), "K", SP811_F)
ok("300 K to F", c_to_f(300 - Fr("273.15")), "F", SP811_F)
ok("350 F to C", f_to_c(350), "C", SP811_F)
ok("20 degrees C to F", c_to_f(20), "F", SP811_F)
ok("72 degrees F in Celsius", f_to_c(72), "Celsius", SP811_F)
ok("37 °C in °F", c_to_f(37), "°F", SP811_F)
ok("451 ºF to ºC", f_to_c(451), "°C", SP811_F + "; º typed for °")
ok("180 ℃ to ℉", c_to_f(180), "℉", SP811_F)
ok("convert 100 from celsius to fahrenheit", c_to_f(100), "fahrenheit", SP811_F)
ok("what is 25 C in F?", c_to_f(25), "F", SP811_F)
ok("what is 100 F in Celsius?", f_to_c(100), "Celsius", SP811_F)
ok("−40 °C to °F", c_to_f(-40), "°F", SP811_F + "; U+2212 minus")
ok("100 c to f", c_to_f(100), "f", SP811_F + "; c and f typed for C and F")
ok("what's 37 c in f", c_to_f(37), "f", SP811_F)
ok("25 °C/min to K/s", Fr(25, 60), "K/s", SP811_F + "; a Celsius degree as a difference is 1 K")
ok("10 °F/h to K/h", 10 * Fr(5, 9), "K/h", SP811_F + "; a Fahrenheit degree as a difference is 5/9 K")
# ---- question forms ------------------------------------------------------------------------------
ok("how many feet in a mile", MI / FT, "feet", IN59 + "; mile = 5280 ft")
ok("how many feet are in a mile?", MI / FT, "feet", IN59)
ok("how many inches in a foot", FT / INCH, "inches", IN59)
ok("how many ounces in a pound", LB / OZ, "ounces", "NIST SP 811 B.8 (ounce avoirdupois = 1/16 lb)")
ok("how many grams in an ounce", OZ / G, "grams", IN59 + "; ounce = 1/16 lb")
ok("how many seconds in a day", DAY, "seconds", SI)
ok("how many yards is a mile", MI / YD, "yards", IN59)
ok("how many km is 26.2 miles", Fr("26.2") * MI / KM, "km", IN59)
ok("how many ml are in 3 cups", 3 * CUP_US / ML, "ml", HB44)
ok("how many cm in 5 ft 11 in", (5 * FT + 11 * INCH) / CM, "cm", IN59)
ok("how many minutes in 2.5 hours", Fr("2.5") * H / MIN, "minutes", SI)
ok("how many acres in a square mile", MI**2 / ACRE, "acres", "acre = 43 560 ft^2 (" + MEM + "); " + IN59)
ok("how many liters in a cubic meter", M3 / L, "liters", SI)
ok("how many pounds is 50 kg?", 50 * KG / LB, "pounds", IN59)
ok("how many kilograms are there in a stone", ST / KG, "kilograms", WMA + "; stone = 14 lb")
ok("how many meters in a kilometer", KM / M, "meters", SI)
# ---- arrow and equals forms ----------------------------------------------------------------------
ok("10 kg -> lb", 10 * KG / LB, "lb", IN59)
ok("5 km → mi", 5 * KM / MI, "mi", IN59)
ok("100km->mi", 100 * KM / MI, "mi", IN59)
ok("5 km = ? mi", 5 * KM / MI, "mi", IN59)
ok("26.2 mi = ? km", Fr("26.2") * MI / KM, "km", IN59)
ok("60 mph -> km/h", 60 * MPH / KMH, "km/h", IN59)
ok("1 atm -> psi", ATM / PSI, "psi", "NIST SP 811 B.8 (atmosphere = 101 325 Pa; psi = lbf/in^2)")
ok("5 km is how many miles", 5 * KM / MI, "miles", IN59)
ok("convert 5 km into miles", 5 * KM / MI, "miles", IN59)
ok("5 km as miles", 5 * KM / MI, "miles", IN59)
ok("5 km in terms of miles", 5 * KM / MI, "miles", IN59)
ok("convert 1 mile to km please", MI / KM, "km", IN59)
ok("how many cups is 500 ml", 500 * ML / CUP_US, "cups", HB44)
ok("100 mbps to MB/s", Fr(100 * 10**6, 8 * 10**6), "MB/s", "IEC 80000-13:2008 (byte = 8 bit); SI prefixes M = 10^6; mbps read as Mbps")
# ---- quantities in parts -------------------------------------------------------------------------
ok("5 ft 11 in to cm", (5 * FT + 11 * INCH) / CM, "cm", IN59)
ok("6 ft 2 in in m", (6 * FT + 2 * INCH) / M, "m", IN59)
ok("5'11\" to cm", (5 * FT + 11 * INCH) / CM, "cm", IN59 + "; prime and double prime as feet and inches")
ok("5′ 11″ to cm", (5 * FT + 11 * INCH) / CM, "cm", IN59)
ok("6' 2'' to cm", (6 * FT + 2 * INCH) / CM, "cm", IN59)
ok("5ft 11in to cm", (5 * FT + 11 * INCH) / CM, "cm", IN59)
ok("5ft11in to cm", (5 * FT + 11 * INCH) / CM, "cm", IN59)
ok("5 ft 11.5 in to cm", (5 * FT + Fr("11.5") * INCH) / CM, "cm", IN59)
ok("5 ft 11 1/2 in to cm", (5 * FT + Fr(23, 2) * INCH) / CM, "cm", IN59)
ok("2 lb 3 oz to kg", (2 * LB + 3 * OZ) / KG, "kg", IN59)
ok("1 lb 8 oz to g", (LB + 8 * OZ) / G, "g", IN59)
ok("10 lbs 4 oz to kg", (10 * LB + 4 * OZ) / KG, "kg", IN59)
ok("11 st 6 lb to kg", (11 * ST + 6 * LB) / KG, "kg", WMA + "; stone = 14 lb; " + IN59)
ok("1 h 30 min to min", (H + 30 * MIN) / MIN, "min", SI)
ok("1 hour and 30 minutes to seconds", H + 30 * MIN, "seconds", SI)
ok("2 h 15 min to h", (2 * H + 15 * MIN) / H, "h", SI)
ok("1 yd 2 ft to m", (YD + 2 * FT) / M, "m", IN59)
ok("1 m 80 cm to ft", (M + 80 * CM) / FT, "ft", IN59)
ok("30° 15′ 10″ to °", 30 + 15 * ARCMIN + 10 * ARCSEC, "°", "SI Brochure Table 8 (1° = 60′ = 3600″)")
# ---- targets in parts ----------------------------------------------------------------------------
mixed("180 cm to ft+in", 180 * CM / INCH, ["ft", "in"], [12, 1], IN59)
mixed("180 cm to feet and inches", 180 * CM / INCH, ["feet", "inches"], [12, 1], IN59)
mixed("1.75 m to ft+in", Fr("1.75") / INCH, ["ft", "in"], [12, 1], IN59)
mixed("100 kg to st+lb", 100 * KG / LB, ["st", "lb"], [14, 1], WMA + "; " + IN59)
mixed("1 kg to lb+oz", KG / OZ, ["lb", "oz"], [16, 1], IN59)
mixed("3.5 kg in lb and oz", Fr("3.5") / OZ, ["lb", "oz"], [16, 1], IN59)
mixed("90 min to h+min", 90, ["h", "min"], [60, 1], SI)
mixed("10000 s to h+min+s", 10000, ["h", "min", "s"], [3600, 60, 1], SI)
mixed("100000 s to d+h+min+s", 100000, ["d", "h", "min", "s"], [86400, 3600, 60, 1], SI)
mixed("5 ft 11 in to m+cm", (5 * FT + 11 * INCH) / CM, ["m", "cm"], [100, 1], IN59)
mixed("1.5 h to h+min", 90, ["h", "min"], [60, 1], SI)
mixed("30.2528 ° to °+′+″", Fr("30.2528") * 3600, ["°", "′", "″"], [3600, 60, 1],
      "SI Brochure Table 8 (1° = 60′ = 3600″)")
mixed("-1.5 h to h+min", -90, ["h", "min"], [60, 1], SI + "; each part negative, as ICU4J writes mixed units")
# ---- fractions and words as amounts --------------------------------------------------------------
ok("1/2 cup_us to mL", CUP_US / 2 / ML, "mL", HB44)
ok("3/4 in to mm", Fr(3, 4) * INCH / MM, "mm", IN59)
ok("1/8 in to mm", INCH / 8 / MM, "mm", IN59)
ok("5/16 in in mm", Fr(5, 16) * INCH / MM, "mm", IN59)
ok("3/4 cup to ml", Fr(3, 4) * CUP_US / ML, "ml", HB44)
ok("1/3 cup to ml", CUP_US / 3 / ML, "ml", HB44)
ok("2/3 cup to tbsp", Fr(2, 3) * CUP_US / TBSP_US, "tbsp", HB44)
ok("1/4 tsp to ml", TSP_US / 4 / ML, "ml", HB44)
ok("1 1/4 in to mm", Fr(5, 4) * INCH / MM, "mm", IN59)
ok("1-1/2 in to mm", Fr(3, 2) * INCH / MM, "mm", IN59)
ok("1 1/2 cups to ml", Fr(3, 2) * CUP_US / ML, "ml", HB44)
ok("½ cup to ml", CUP_US / 2 / ML, "ml", HB44)
ok("2 ¾ cups to ml", Fr(11, 4) * CUP_US / ML, "ml", HB44)
ok("half a cup to ml", CUP_US / 2 / ML, "ml", HB44)
ok("a quarter cup to tbsp", CUP_US / 4 / TBSP_US, "tbsp", HB44)
ok("a mile to km", MI / KM, "km", IN59)
ok("one and a half cups to ml", Fr(3, 2) * CUP_US / ML, "ml", HB44)
# ---- area and volume spellings -------------------------------------------------------------------
ok("1 m2 to sq ft", M2 / FT**2, "sq ft", IN59)
ok("1000 sq ft to m2", 1000 * FT**2, "m2", IN59)
ok("100 sq. ft. to m²", 100 * FT**2, "m²", IN59)
ok("50 sqm to sqft", 50 / FT**2, "sq ft", IN59)
ok("1 sq km to acres", KM**2 / ACRE, "acres", "acre = 43 560 ft^2 (" + MEM + "); " + IN59)
ok("1 acre to sq m", ACRE, "sq m", "acre = 43 560 ft^2 (" + MEM + "); " + IN59)
ok("2 cubic meters to cubic feet", 2 / FT**3, "cubic feet", IN59)
ok("1 cu ft to L", FT**3 / L, "L", IN59)
ok("10 cubic feet to m3", 10 * FT**3, "m3", IN59)
ok("1 cu. in. to cc", INCH**3 / CC, "cc", IN59)
ok("500 cc to cubic inches", 500 * CC / INCH**3, "cubic inches", IN59)
ok("1 ha to acres", HA / ACRE, "acres", SI + "; acre 43 560 ft^2 (" + MEM + ")")
ok("1 sq mi to km2", MI**2 / KM**2, "km2", IN59)
# ---- case slips with one reading -----------------------------------------------------------------
ok("10 KM to miles", 10 * KM / MI, "miles", IN59 + "; KM read as km")
ok("5 Kg to lbs", 5 * KG / LB, "lbs", IN59 + "; Kg read as kg")
ok("100 LBS to KG", 100 * LB / KG, "KG", IN59)
ok("6 FT to M", 6 * FT / M, "M", IN59 + "; M beside a length read as m")
ok("60 MPH to KPH", 60 * MPH / KMH, "KPH", IN59)
ok("100 KPA to psi", 100 * KPA / PSI, "psi", "NIST SP 811 B.8 (psi = lbf/in^2); KPA read as kPa")
ok("5 Km to mi", 5 * KM / MI, "mi", IN59)
ok("1 M to ft", M / FT, "ft", IN59 + "; M beside a length read as m")
# ---- other everyday spellings --------------------------------------------------------------------
ok("1 kt to km/h", KNOT / KMH, "km/h", "NIST SP 811 B.8 (knot = 1852 m/h)")
ok("12 pt to px", 12 * PT_DTP / PX, "px", "CSS Values and Units 3 (1pt = 1/72 in, 1px = 1/96 in) (" + MEM + ")")
ok("1,250,000 m to km", 1250000 * M / KM, "km", SI + "; thousands grouped by commas")
ok("1 250 000 m to km", 1250000 * M / KM, "km", SI + " 5.4.4 (digits grouped in threes by spaces)")
ok("2,5 kg to lb", Fr(5, 2) * KG / LB, "lb", IN59 + "; a decimal comma")
ok("10 kms to miles", 10 * KM / MI, "miles", IN59)
ok("5 mins to s", 5 * MIN, "s", SI)
ok("3 hrs. to min", 3 * H / MIN, "min", SI)
ok("10 lbs. to kg", 10 * LB / KG, "kg", IN59)
ok("4 kgs to lb", 4 * KG / LB, "lb", IN59)
ok("12 oz. to g", 12 * OZ / G, "g", IN59)
ok("1e3 m to km", 1000 * M / KM, "km", SI)
ok("100/min to Hz", Fr(100, 60), "Hz", SI + "; Hz = 1/s")
ok("1 ltr to ml", L / ML, "ml", SI)
# ---- what units@1 already answered ---------------------------------------------------------------
ok("3.5 km to mi", Fr("3.5") * KM / MI, "mi", IN59)
ok("100 km/h to mph", 100 * KMH / MPH, "mph", IN59)
ok("1 atm to psi", ATM / PSI, "psi", "NIST SP 811 B.8 (atmosphere = 101 325 Pa; psi = lbf/in^2)")
ok("1 lb to kg", LB, "kg", IN59)
ok("1 mi to ft", MI / FT, "ft", IN59)
ok("72 in to cm", 72 * INCH / CM, "cm", IN59)
ok("500 g to oz", 500 * G / OZ, "oz", IN59)
ok("6 ft to m", 6 * FT, "m", IN59)
ok("1 bar to psi", BAR / PSI, "psi", "NIST SP 811 B.8 (bar = 10^5 Pa; psi = lbf/in^2)")
ok("1 nmi to km", NMI / KM, "km", "NIST SP 811 B.8 (nautical mile = 1852 m)")
ok("20 Δ°C to Δ°F", 20 * Fr(9, 5), "Δ°F", SP811_F)
ok("8 L/100km to mpg", (100 * KM / (8 * L)) / (MI / GAL_US), "mpg", HB44 + "; mpg is per US gallon under system us")
ok("30 mpg to L/100km", 100 * KM / (30 * MI / GAL_US) / L, "L/100km", HB44)
ok("1 GiB to MB", Fr(2**30, 10**6), "MB", "IEC 80000-13:2008 (GiB = 2^30 B, MB = 10^6 B)")
ok("1 light year to km", Fr(299792458) * Fr("365.25") * DAY / KM, "km", "SI Brochure Table 1 (c); Julian year 365.25 d (" + MEM + ")")
ok("1 knot to km/h", KNOT / KMH, "km/h", "NIST SP 811 B.8 (knot = 1852 m/h)")
ok("100 kPa to bar", 100 * KPA / BAR, "bar", "NIST SP 811 B.8 (bar = 10^5 Pa)")
# ---- truly ambiguous: refused, readings listed ---------------------------------------------------
refuse("1 ton to kg", "ambiguous_unit", "NIST SP 811 B.8 lists ton (short), ton (long) and ton (metric)",
       ["ton_short", "ton_long", "t"])
refuse("2000 calories to kJ", "ambiguous_unit",
       "NIST SP 811 B.8 (calorie_th, calorie_IT; the nutrition calorie is the kilocalorie)", ["kcal_th", "cal_th", "cal_IT"])
refuse("1,250 m to km", "syntax_error", "a comma before three digits groups thousands in English, and is a decimal comma"
       " elsewhere (" + MEM + ")", ["1250", "1.25"])
refuse("how many days in a year", "ambiguous_unit", "NIST SP 811 B.8 (year, 365 days); Julian and Gregorian years ("
       + MEM + ")", ["yr_365", "yr_julian", "yr_gregorian"])
refuse("1 MM to in", "ambiguous_unit", "SI Brochure Table 7: M (mega) and m (milli) differ by case", ["mm", "Mm"])
refuse("1 cup of flour to grams", "dimension_mismatch", "volume and mass convert only through a density (" + MEM + ")")
refuse("1 KB to B", "ambiguous_unit", "IEC 80000-13:2008 (kB = 1000 B; KiB = 1024 B)", ["kB", "KiB"])
refuse("1 gallon to L", "ambiguous_unit", "no metric gallon; a gallon is US (HB 44) or imperial (WMA 1985)",
       ["gal_us", "gal_imp"], {"system": "metric"})

with open("units.jsonl", "w", encoding="utf-8") as f:
    for c in cases:
        f.write(json.dumps(c, ensure_ascii=False) + "\n")
answered = sum(1 for c in cases if "expect" in c)
print(f"{len(cases)} cases, {answered} to be answered ({100 * answered / len(cases):.1f} %)")
