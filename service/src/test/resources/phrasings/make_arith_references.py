#!/usr/bin/env python3
"""Writes arith.jsonl: arithmetic requests as models and people write them, each with its answer
computed here, independently of Reckoner, with Python 3.11's fractions, decimal and math modules.

Each case states what the phrase means as Python computes it (exact Fractions for arithmetic,
decimal.Decimal.sqrt for correctly rounded square roots, math for binary64 functions), then rounds
and formats the value by the contract's number rules (default 2 places, half_even; trailing zeros
trimmed; plain notation for 1e-6 <= |x| < 1e21). The build does not run this script; run it from
this folder to regenerate the file:  python3 make_arith_references.py > arith.jsonl
"""
import json
import math
import sys
from decimal import Decimal, getcontext
from fractions import Fraction as F

getcontext().prec = 60

PY = "Python 3.11 fractions, computed"
PY_DEC = "Python 3.11 decimal (sqrt correctly rounded at 34 digits), computed"
PY_MATH = "Python 3.11 math (binary64), computed"
NIST = "NIST SP 811 7.10.2 (% = 0.01); Python 3.11 fractions, computed"
CALC = "percentage of the left operand, as on calculators (a + b% = a(1 + b/100)); Python 3.11 fractions, computed"


def round_fraction(x, places, mode):
    """x rounded to `places` decimal places (may be negative) with the contract's rounding modes."""
    scaled = x * F(10) ** places
    q, r = divmod(scaled.numerator, scaled.denominator)  # floor division: r >= 0
    frac = F(r, scaled.denominator)
    if frac == 0:
        n = q
    else:
        lower, upper = q, q + 1
        toward_zero = lower if x >= 0 else upper
        away = upper if x >= 0 else lower
        if mode == "floor":
            n = lower
        elif mode == "ceiling":
            n = upper
        elif mode == "down":
            n = toward_zero
        elif mode == "up":
            n = away
        elif frac < F(1, 2):
            n = lower
        elif frac > F(1, 2):
            n = upper
        elif mode == "half_even":
            n = lower if lower % 2 == 0 else upper
        elif mode == "half_up":
            n = away
        elif mode == "half_down":
            n = toward_zero
        else:
            raise ValueError(mode)
    return Decimal(n).scaleb(-places)


def floor_log10(x):
    x = abs(x)
    e = len(str(x.numerator)) - len(str(x.denominator))
    while F(10) ** e > x:
        e -= 1
    while F(10) ** (e + 1) <= x:
        e += 1
    return e


def fmt(d):
    if d == 0:
        return "0"
    d = d.normalize()
    if Decimal("1e-6") <= abs(d) < Decimal("1e21"):
        s = format(d, "f")
        if "." in s:
            s = s.rstrip("0").rstrip(".")
        return s
    sign, digits, exp = d.as_tuple()
    ds = "".join(map(str, digits))
    e = len(ds) - 1 + exp
    mant = ds[0] + ("." + ds[1:] if len(ds) > 1 else "")
    return ("-" if sign else "") + mant + "e" + ("-" if e < 0 else "+") + str(abs(e))


def answer(x, places=None, digits=None, rounding="half_even"):
    if isinstance(x, float):
        x = F(Decimal(x))  # the exact binary64 value
    elif isinstance(x, Decimal):
        x = F(x)
    else:
        x = F(x)
    if digits is not None:
        if x == 0:
            return "0"
        places = digits - 1 - floor_log10(x)
    elif places is None:
        places = 2
    return fmt(round_fraction(x, places, rounding))


def dsqrt(n, prec=34):
    ctx = getcontext().copy()
    ctx.prec = prec
    return ctx.sqrt(Decimal(n) if not isinstance(n, F) else Decimal(n.numerator) / Decimal(n.denominator))


PI60 = F(Decimal("3.14159265358979323846264338327950288419716939937510582097494"))
E60 = F(Decimal("2.71828182845904523536028747135266249775724709369995957496697"))

cases = []


def ok(text, value, ref, args=None, **rounding):
    line = {"text": text}
    if args:
        line["args"] = args
    line["expect"] = answer(value, **rounding)
    line["reference"] = ref
    cases.append(line)


def refuse(text, code, ref, readings=None, suggests=None):
    line = {"text": text, "refuse": code}
    if readings:
        line["readings"] = readings
    if suggests:
        line["suggests"] = suggests
    line["reference"] = ref
    cases.append(line)


# ---- plain expressions, as version 1 documents them ----
ok("1250/4000", F(1250, 4000), PY)
ok("2+2", 4, PY)
ok("(3+4)*2", 14, PY)
ok("25 * 4", 100, PY)
ok("2^10", 2 ** 10, PY)
ok("0.1 + 0.2", F(1, 10) + F(2, 10), PY)
ok("-5 + 3", -2, PY)
ok("7 - -3", 10, PY)
ok("2 + 3 * 4", 14, PY)
ok("8 / 2 * 4", F(8, 2) * 4, "left to right at equal precedence; " + PY)
ok("1/7", F(1, 7), PY)
ok("3.5 * 2.4", F(35, 10) * F(24, 10), PY)
ok("1e6 / 3", F(10 ** 6, 3), PY)
ok("1.2e5 * 3", F(120000) * 3, PY)
ok("(45 + 55) / 2", F(100, 2), PY)
ok("15/100 * 80", F(15, 100) * 80, PY)
ok("100 * 1.05^3", 100 * F(105, 100) ** 3, PY)
ok("sqrt(2)", dsqrt(2), PY_DEC)
ok("abs(-3.5)", F(35, 10), PY)
ok("floor(7.8)", 7, PY)
ok("ceil(7.2)", 8, PY)
ok("2^0.5", 2 ** 0.5, PY_MATH)
ok("2^-2", F(1, 4), PY)
ok("-2^2", -(2 ** 2), "unary minus binds looser than ^, as Python's -2**2; " + PY)
ok("2^3^2", 2 ** (3 ** 2), "right-associative power, as Python's 2**3**2; " + PY)
ok("1/3 + 1/4", F(1, 3) + F(1, 4), PY)
ok("2(3+4)", 14, PY)
ok("ln(10)", math.log(10), PY_MATH)
ok("log10(1000)", 3, PY)
ok("exp(2)", math.exp(2), PY_MATH)
ok("sin(pi/2)", math.sin(float(PI60 / 2)), PY_MATH)
ok("9 × 8", 72, PY)
ok("100 ÷ 4", 25, PY)
ok("1/3 + 1/3 + 1/3", 1, PY, args={"digits": 34}, digits=34)
ok("1 + (-1e-383)", 1 - F(1, 10 ** 383), PY, args={"digits": 16, "rounding": "down"}, digits=16, rounding="down")
ok("1000*(1+0.04/12)^(12*5)", 1000 * (1 + F(4, 100) / 12) ** 60, "monthly compound interest; " + PY)

# ---- Python and other programming notation, as models write it ----
ok("2**10", 2 ** 10, PY)
ok("10 ** -2", F(1, 100), PY)
ok("2 ** 0.5", 2 ** 0.5, PY_MATH)
ok("17 // 5", 17 // 5, "Python floor division; " + PY)
ok("-17 // 5", -17 // 5, "Python floor division; " + PY)
ok("math.sqrt(16)", 4, PY_MATH)
ok("math.pi * 2", 2 * PI60, "pi to 60 digits; " + PY)
ok("math.log(100)", math.log(100), "Python math.log is natural; " + PY_MATH)
ok("math.log(8, 2)", 3, "Python math.log(x, base); " + PY)
ok("math.log10(1000)", 3, PY)
ok("math.factorial(6)", math.factorial(6), PY)
ok("math.comb(10, 3)", math.comb(10, 3), PY)
ok("Math.pow(2, 10)", 2 ** 10, "JavaScript Math.pow(base, exponent); " + PY)
ok("Math.PI", PI60, "pi to 60 digits; " + PY)
ok("pow(2, 8)", 2 ** 8, "Python pow(base, exp); " + PY)
ok("round(3.14159, 2)", F(314159, 100000), PY, places=2)
ok("round(2.5)", F(5, 2), "Python round: ties to even; " + PY, places=0)
ok("abs(-5)", 5, PY)
ok("max(3, 7, 2)", 7, PY)
ok("min(3, 7, 2)", 2, PY)
ok("sum([1, 2, 3, 4])", 10, PY)
ok("int(7/2)", int(F(7, 2)), "Python int truncates; " + PY)
ok("gcd(48, 18)", math.gcd(48, 18), PY)
ok("lcm(4, 6)", math.lcm(4, 6), PY)
ok("e**2", E60 ** 2, "e to 60 digits; " + PY)
ok("exp(1)", math.exp(1), PY_MATH)
ok("3 * 10**8", 3 * 10 ** 8, PY)
ok("6.02e23 / 1000", F(602, 100) * 10 ** 23 / 1000, PY)
ok("1_000_000 / 8", F(1000000, 8), "Python digit grouping with underscores; " + PY)
ok("`2**16`", 2 ** 16, "backquotes as markdown code; " + PY)
ok("=2*3+1", 7, "a spreadsheet formula's leading '='; " + PY)

# ---- words around the expression ----
ok("what is 25 * 4", 100, PY)
ok("What is 25 times 4?", 100, PY)
ok("what's 7 plus 5", 12, PY)
ok("What's 12 * 3 + 4?", 40, PY)
ok("Calculate 45 divided by 9.", 5, PY)
ok("calculate: (3 + 4) * 2", 14, PY)
ok("compute 3^4", 3 ** 4, PY)
ok("Evaluate (1.05)^10", F(105, 100) ** 10, PY)
ok("how much is 3 times 7", 21, PY)
ok("what is 10 divided by 4", F(10, 4), PY)
ok("what is 10 over 4", F(10, 4), PY)
ok("what is 2 + 2?", 4, PY)
ok("2+2=", 4, PY)
ok("2 + 2 = ?", 4, PY)
ok("What is 144 / 12? Thanks", 12, PY)
ok("please calculate 17 * 23", 17 * 23, PY)
ok("can you compute 1000 - 357", 643, PY)
ok("what is 2 + 2 equal to", 4, PY)
ok("find the value of 9 * 9", 81, PY)
ok("what is 6 x 7", 42, PY)
ok("6 x 7", 42, PY)
ok("12x12", 144, PY)
ok("what is 7 minus 10", -3, PY)
ok("what is negative 8 times 3", -24, PY)
ok("minus 4 plus 10", 6, PY)
ok("what is 100 multiplied by 0.15", 15, PY)
ok("what is 1000 * (1 + 0.05)^10", 1000 * F(105, 100) ** 10, PY)

# ---- roots, powers, factorials in words and signs ----
ok("what's the square root of 81", 9, PY)
ok("square root of 2", dsqrt(2), PY_DEC)
ok("what is the square root of 144?", 12, PY)
ok("sqrt of 50", dsqrt(50), PY_DEC)
ok("cube root of 64", 4, PY)
ok("∛27", 3, PY)
ok("√16", 4, PY)
ok("√2", dsqrt(2), PY_DEC)
ok("3√2", 3 * F(dsqrt(2)), PY_DEC)
ok("fourth root of 81", 3, PY)
ok("5th root of 32", 2, PY)
ok("2 to the power of 8", 2 ** 8, PY)
ok("what is 5 to the 3rd power", 5 ** 3, PY)
ok("2 raised to the 5th power", 2 ** 5, PY)
ok("2 raised to 10", 2 ** 10, PY)
ok("5 squared", 25, PY)
ok("10 cubed", 1000, PY)
ok("what is 9 squared minus 4 squared", 81 - 16, PY)
ok("the square of 12", 144, PY)
ok("2²", 4, PY)
ok("what's 3³", 27, PY)
ok("5 × 10⁻²", F(5, 100), PY)
ok("2 × 10⁶", 2 * 10 ** 6, PY)
ok("1.5 x 10^3", 1500, PY)
ok("5!", math.factorial(5), PY)
ok("What is 7 factorial?", math.factorial(7), PY)
ok("factorial of 10", math.factorial(10), PY)
ok("20!", math.factorial(20), PY)
ok("10 choose 3", math.comb(10, 3), PY)
ok("52 choose 5", math.comb(52, 5), PY)

# ---- logarithms and trigonometry ----
ok("log(100)", 2, "common logarithm (base 10), as on calculators; " + PY)
ok("log(1000)", 3, "common logarithm (base 10); " + PY)
ok("log 2", math.log10(2), "common logarithm (base 10); " + PY_MATH)
ok("ln(e)", 1, PY_MATH)
ok("natural log of 10", math.log(10), PY_MATH)
ok("log base 2 of 64", 6, PY)
ok("log2(256)", 8, PY)
ok("log₂(8)", 3, PY)
ok("log_3(81)", 4, PY)
ok("sin(90°)", 1, "sin 90 degrees = 1 exactly; " + PY)
ok("sin(30°)", F(1, 2), "sin 30 degrees = 1/2 exactly; " + PY, args={"digits": 10}, digits=10)
ok("cos(60 degrees)", F(1, 2), "cos 60 degrees = 1/2 exactly; " + PY)
ok("tan 45°", 1, "tan 45 degrees = 1 exactly; " + PY)
ok("sin 25 degrees", math.sin(math.radians(25)), PY_MATH)
ok("cos(0)", 1, PY)
ok("sin(1)", math.sin(1), PY_MATH)
ok("asin(1)", math.asin(1), PY_MATH)
ok("arctan(1)", math.atan(1), PY_MATH)
ok("e^1", E60, "e to 60 digits; " + PY)

# ---- percentages ----
ok("15% of 80", F(15, 100) * 80, NIST)
ok("What's 15% of 80?", F(15, 100) * 80, NIST)
ok("200*2.5%", 200 * F(25, 1000), NIST)
ok("how much is 12.5% of 240", F(125, 1000) * 240, NIST)
ok("20% of 150", 30, NIST)
ok("15 percent of 300", 45, NIST)
ok("15 per cent of 200", 30, NIST)
ok("what is 40% of 50% of 200", F(40, 100) * F(50, 100) * 200, NIST)
ok("5% of 0.5", F(5, 100) * F(1, 2), NIST)
ok("80 + 15%", 80 * (1 + F(15, 100)), CALC)
ok("what is 80 plus 15%", 80 * (1 + F(15, 100)), CALC)
ok("200 - 10%", 200 * (1 - F(10, 100)), CALC)
ok("what is 45 minus 12 percent", 45 * (1 - F(12, 100)), CALC)
ok("10% + 5%", F(10, 100) + F(5, 100), NIST)
ok("increase 50 by 10%", 50 * F(110, 100), CALC)
ok("decrease 200 by 25%", 200 * F(75, 100), CALC)
ok("20% off 80", 80 * F(80, 100), "a discount of 20% of 80; " + PY)
ok("what is 15% more than 200", 200 * F(115, 100), "15% of 200 added to 200; " + PY)
ok("what percentage of 200 is 50", F(50, 200) * 100, "50 / 200 * 100; " + PY)
ok("50 is what percent of 200", F(50, 200) * 100, "50 / 200 * 100; " + PY)
ok("12 out of 80 as a percentage", F(12, 80) * 100, "12 / 80 * 100; " + PY)
ok("what is 3/4 as a percentage", 75, "3 / 4 * 100; " + PY)
ok("0.35 as a percentage", 35, "0.35 * 100; " + PY)
ok("percent change from 80 to 100", F(100 - 80, 80) * 100, "(new - old) / old * 100; " + PY)
ok("percentage decrease from 50 to 40", F(50 - 40, 50) * 100, "(old - new) / old * 100; " + PY)
ok("1250/4000*100", F(1250, 4000) * 100, PY)

# ---- mod, remainders, integer division ----
ok("7 mod 3", 1, PY)
ok("17 modulo 4", 1, PY)
ok("-7 mod 3", -7 % 3, "mod with the sign of the divisor, as Python's %; " + PY)
ok("the remainder when 29 is divided by 6", 29 % 6, PY)
ok("remainder of 100 divided by 7", 100 % 7, PY)
ok("mod(17, 5)", 17 % 5, "spreadsheet MOD(number, divisor); " + PY)
ok("rem(-7, 3)", math.fmod(-7, 3), "C fmod / Python math.fmod: sign of the dividend; " + PY_MATH)

# ---- numbers written as people write them ----
ok("1,000,000 / 3", F(1000000, 3), PY)
ok("$1,250 * 12", 1250 * 12, "currency sign dropped; " + PY)
ok("€49.99 * 3", F(4999, 100) * 3, "currency sign dropped; " + PY)
ok("what is 3 billion divided by 12", F(3 * 10 ** 9, 12), "short scale (billion = 10^9); " + PY)
ok("2.5 million times 3", F(25, 10) * 10 ** 6 * 3, PY)
ok("four plus four", 8, PY)
ok("twelve times twelve", 144, PY)
ok("one hundred divided by eight", F(100, 8), PY)
ok("twenty-five plus seventeen", 42, PY)
ok("what is one third of 99", F(99, 3), PY)
ok("half of 250", F(250, 2), PY)
ok("a quarter of 360", 90, PY)
ok("two thirds of 120", 80, PY)
ok("three quarters of 80", 60, PY)
ok("twice 17", 34, PY)
ok("double 45", 90, PY)
ok("2½ + 1¼", F(5, 2) + F(5, 4), PY)
ok("1 1/2 + 2 3/4", F(3, 2) + F(11, 4), "mixed numbers; " + PY)
ok("|−7|", 7, PY)
ok("absolute value of -12", 12, PY)
ok("reciprocal of 8", F(1, 8), PY)

# ---- lists ----
ok("the average of 4, 8 and 15", F(4 + 8 + 15, 3), PY)
ok("mean of 2, 3, 5, 7", F(2 + 3 + 5 + 7, 4), PY)
ok("sum of 12, 15 and 20", 47, PY)
ok("product of 4 and 25", 100, PY)
ok("difference between 100 and 37", 63, PY)
ok("quotient of 56 and 8", 7, PY)
ok("add 3 to 10", 13, PY)
ok("subtract 3 from 10", 7, PY)
ok("multiply 6 by 7", 42, PY)
ok("divide 10 by 4", F(10, 4), PY)

# ---- rounding asked for in words ----
ok("what is 100 divided by 7, to 3 decimal places", F(100, 7), PY, places=3)
ok("22/7 to 4 decimal places", F(22, 7), PY, places=4)
ok("pi to 5 decimal places", PI60, "pi to 60 digits; " + PY, places=5)
ok("round 2.567 to 1 decimal place", F(2567, 1000), PY, places=1)
ok("round 1234.5678 to the nearest hundred", F(12345678, 10000), PY, places=-2)
ok("what is 1/3 rounded to 2 decimal places", F(1, 3), PY, places=2)
ok("sqrt(2) to 3 sig figs", dsqrt(2), PY_DEC, digits=3)
ok("22/7 to 3 significant figures", F(22, 7), PY, digits=3)
ok("1/3 to the nearest hundredth", F(1, 3), PY, places=2)
ok("7/2 rounded up", F(7, 2), "rounded up: toward positive infinity; " + PY, places=0, rounding="ceiling")
ok("e to 10 decimal places", E60, "e to 60 digits; " + PY, places=10)
ok("(1 + 0.05/365)^(365*30)", (1 + F(5, 100) / 365) ** (365 * 30), "daily compounding for 30 years; " + PY)

# ---- a second batch, written down before it was run against the tool ----
ok("What is 3 + 5 * 2?", 13, PY)
ok("whats 9*9", 81, PY)
ok("How much is 250 divided by 5?", 50, PY)
ok("Can you tell me what 15 times 15 is?", 225, PY)
ok("what is 48/6", 8, PY)
ok("Compute the product of 7 and 8", 56, PY)
ok("What is the sum of 15 and 27?", 42, PY)
ok("Calculate 2 to the 8th", 2 ** 8, PY)
ok("what's 2 to the 5th power", 2 ** 5, PY)
ok("What is 3 squared plus 4 squared?", 3 ** 2 + 4 ** 2, PY)
ok("What is 1.5 times 4?", 6, PY)
ok("what is 0.5 + 0.25", F(3, 4), PY)
ok("What is 10% of 250?", 25, NIST)
ok("What is 7.5% of 1200?", F(75, 1000) * 1200, NIST)
ok("Calculate 18% of 45", F(18, 100) * 45, NIST)
ok("How much is 20 percent of 80?", 16, NIST)
ok("What's 30% off $50?", 50 * F(70, 100), "a discount of 30% of 50; " + PY)
ok("What is 1/4 + 1/2?", F(3, 4), PY)
ok("What is 3/8 in decimal?", F(3, 8), PY)
ok("What is 2/5 as a percent?", 40, "2 / 5 * 100; " + PY)
ok("What is 144 divided by 12 plus 3?", 15, PY)
ok("What is 5 cubed?", 125, PY)
ok("what's the cube root of 125", 5, PY)
ok("What is the square root of 0.25?", F(1, 2), PY)
ok("what's sqrt(144)", 12, PY)
ok("What is the value of 4!?", 24, PY)
ok("What is 6 factorial divided by 4 factorial?", F(math.factorial(6), math.factorial(4)), PY)
ok("what is 2^20", 2 ** 20, PY)
ok("Evaluate 3 * (4 + 5)", 27, PY)
ok("What is 100 - 37?", 63, PY)
ok("What is -3 times -4?", 12, PY)
ok("What is 12 divided by 0.5?", 24, PY)
ok("what is 1 million divided by 8", F(10 ** 6, 8), PY)
ok("What is 7 times 8 minus 6?", 50, PY)
ok("What is (10 + 5) / 3?", 5, PY)
ok("What's 99 + 1?", 100, PY)
ok("Round 3.14159 to two decimal places", F(314159, 100000), PY, places=2)
ok("What is 1000 divided by 3 rounded to the nearest whole number?", F(1000, 3), PY, places=0)
ok("What is 17 mod 4?", 1, PY)
ok("What is the remainder of 17 divided by 4?", 1, PY)
ok("what is 5 + 5 + 5 + 5", 20, PY)
ok("What is 2.5 squared?", F(25, 10) ** 2, PY)
ok("what is 0.1 * 0.3", F(3, 100), PY)
ok("what is 1/3 of 60", 20, PY)
ok("what's a fifth of 55", 11, PY)
ok("How much is 4 dozen?", 48, PY)
ok("What is 25% of 25% of 400?", F(25, 100) * F(25, 100) * 400, NIST)
ok("what is 12 percent of 1,500", F(12, 100) * 1500, NIST)
ok("What is 100 increased by 20%?", 100 * F(120, 100), CALC)
ok("What is 80 decreased by 25%?", 80 * F(75, 100), CALC)
ok("what is the average of 10, 20, 30, 40", 25, PY)
ok("What's the mean of 3, 7 and 11?", 7, PY)
ok("What is 2 plus 3 times 4?", 14, PY)
ok("What is 50 / 2 / 5?", 5, PY)
ok("What is 3 to the power of 4?", 81, PY)
ok("What's log base 10 of 1000?", 3, PY)
ok("What is ln(1)?", 0, PY)
ok("What is e squared?", E60 ** 2, "e to 60 digits; " + PY)
ok("What is pi times 4?", PI60 * 4, "pi to 60 digits; " + PY)
ok("What is 2 pi?", PI60 * 2, "pi to 60 digits; " + PY)
ok("what is 360 / 7 to 2 decimal places", F(360, 7), PY, places=2)
ok("What is 5/9 * (98.6 - 32)?", F(5, 9) * (F(986, 10) - 32), PY)
ok("What is 9/5 * 37 + 32?", F(9, 5) * 37 + 32, PY)
ok("What's 7 x 6?", 42, PY)
ok("What is 15 × 4?", 60, PY)
ok("what is 81 ÷ 9", 9, PY)
ok("what is −5 + 12", 7, PY)
ok("What is 3.14 * 5^2", F(314, 100) * 25, PY)
ok("What is 4/3 * pi * 3^3?", F(4, 3) * PI60 * 27, "pi to 60 digits; " + PY)
refuse("what is the hypotenuse of 3 and 4", "syntax_error", "geometry, not arithmetic: sqrt(3^2 + 4^2) = 5")

# ---- phrases with two readings: refused with both readings ----
refuse("6/2(1+2)", "syntax_error", "two readings: (6/2)(1+2) = 9 and 6/(2(1+2)) = 1 (from memory: the well-known dispute)",
       readings=["6 / 2 * (1 + 2)", "6 / (2 * (1 + 2))"])
refuse("12 % 5", "syntax_error", "'%' is the remainder in Python and C, a percentage in arithmetic (NIST SP 811 7.10.2)",
       readings=["12 mod 5", "12% * 5"])
refuse("square root of 16 plus 9", "syntax_error", "two readings: sqrt(16) + 9 = 13 and sqrt(25) = 5",
       readings=["sqrt(16) + 9", "sqrt(16 + 9)"])
refuse("log(8, 2)", "syntax_error", "Python math.log(8, 2) = 3 puts the base second; other notations put it first",
       readings=["log_2(8)", "log_8(2)"])
refuse("difference between 3 and 10", "syntax_error", "3 - 10 = -7 or 10 - 3 = 7",
       readings=["3 - 10", "10 - 3"])

# ---- what version 2 still refuses, with the nearest phrase that works ----
refuse("3,5 + 2,5", "syntax_error", "a decimal comma (European notation): 3.5 + 2.5", suggests=["3.5"])
refuse("what is 15% tip on $60", "syntax_error", "a word problem: the words 'tip' and 'on' are not arithmetic",
       suggests=["15% * 60"])
refuse("solve 2x + 3 = 7", "syntax_error", "an equation with a variable, not an expression")
refuse("what is 7 divided by 0", "domain_error", "division by zero has no value")

for c in cases:
    sys.stdout.write(json.dumps(c, ensure_ascii=False) + "\n")
