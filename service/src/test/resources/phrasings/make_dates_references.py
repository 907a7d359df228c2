#!/usr/bin/env python3
"""Writes dates.jsonl beside this script: phrasings of date questions as models and people write
them, each with the answer computed here from outside references, or the refusal expected.

The answers come from Python's datetime and zoneinfo, and from dateutil (Debian: python3-dateutil):
relativedelta for relative days, weekdays, month arithmetic and month ends, rrule for weekdays of a
month and for business days. Holiday dates are the published calendars named beside them, written
down from memory. The conventions the references follow are dates@2's, stated in its spec
(tool-specs/dates/2.json): e.g. next FRIDAY is relativedelta(days=+1, weekday=FR(+1)).

Run: python3 make_dates_references.py   (the build does not run it; its output is committed)
"""
import json
import os
from datetime import date, datetime, timedelta
from zoneinfo import ZoneInfo

from dateutil.relativedelta import relativedelta, MO, TU, WE, TH, FR, SA, SU
from dateutil.rrule import rrule, DAILY

WEEKDAYS = (MO, TU, WE, TH, FR)
NAMES = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"]

# Published holiday calendars (from memory), as the days off they give.
HOLIDAYS = {
    # GOV.UK, "UK bank holidays", England and Wales
    "GB-ENG": {date(2024, 1, 1), date(2024, 3, 29), date(2024, 4, 1), date(2024, 5, 6), date(2024, 5, 27), date(2024, 8, 26),
               date(2024, 12, 25), date(2024, 12, 26), date(2025, 1, 1), date(2025, 4, 18), date(2025, 4, 21), date(2025, 5, 5),
               date(2025, 5, 26), date(2025, 8, 25), date(2025, 12, 25), date(2025, 12, 26)},
    # GOV.UK, "UK bank holidays", Scotland
    "GB-SCT": {date(2024, 1, 1), date(2024, 1, 2), date(2024, 3, 29), date(2024, 5, 6), date(2024, 5, 27), date(2024, 8, 5),
               date(2024, 12, 2), date(2024, 12, 25), date(2024, 12, 26)},
    # US Office of Personnel Management, federal holidays 2024 and 2025 (5 U.S.C. 6103)
    "US": {date(2024, 1, 1), date(2024, 1, 15), date(2024, 2, 19), date(2024, 5, 27), date(2024, 6, 19), date(2024, 7, 4),
           date(2024, 9, 2), date(2024, 10, 14), date(2024, 11, 11), date(2024, 11, 28), date(2024, 12, 25),
           date(2025, 1, 1), date(2025, 1, 20), date(2025, 2, 17), date(2025, 5, 26), date(2025, 6, 19), date(2025, 7, 4),
           date(2025, 9, 1), date(2025, 10, 13), date(2025, 11, 11), date(2025, 11, 27), date(2025, 12, 25)},
    # Germany, nationwide public holidays 2024 (the federal and Länder laws)
    "DE": {date(2024, 1, 1), date(2024, 3, 29), date(2024, 4, 1), date(2024, 5, 1), date(2024, 5, 9), date(2024, 5, 20),
           date(2024, 10, 3), date(2024, 12, 25), date(2024, 12, 26)},
    # Bavaria adds Epiphany, Corpus Christi and All Saints' Day statewide
    "DE-BY": {date(2024, 1, 1), date(2024, 1, 6), date(2024, 3, 29), date(2024, 4, 1), date(2024, 5, 1), date(2024, 5, 9),
              date(2024, 5, 20), date(2024, 5, 30), date(2024, 10, 3), date(2024, 11, 1), date(2024, 12, 25), date(2024, 12, 26)},
    # France, jours fériés 2024 (Code du travail, L3133-1)
    "FR": {date(2024, 1, 1), date(2024, 4, 1), date(2024, 5, 1), date(2024, 5, 8), date(2024, 5, 9), date(2024, 5, 20),
           date(2024, 7, 14), date(2024, 8, 15), date(2024, 11, 1), date(2024, 11, 11), date(2024, 12, 25)},
}
CALENDAR_SOURCES = {
    "GB-ENG": "GOV.UK bank holidays for England and Wales", "GB-SCT": "GOV.UK bank holidays for Scotland",
    "US": "OPM federal holidays", "DE": "German nationwide public holidays", "DE-BY": "Bavarian public holidays",
    "FR": "French jours fériés",
}

cases = []


def d(text):
    return date.fromisoformat(text)


def add(text, expect, reference, as_of="2024-06-12", **args):
    a = dict(args)
    if as_of is not None:
        a["as_of"] = as_of
    cases.append({"text": text, "args": a, "expect": str(expect), "reference": reference})


def refuse(text, code, reference, readings=None, as_of="2024-06-12", **args):
    a = dict(args)
    if as_of is not None:
        a["as_of"] = as_of
    case = {"text": text, "args": a, "refuse": code}
    if readings:
        case["readings"] = readings
    case["reference"] = reference
    cases.append(case)


def at(day):
    return datetime.combine(day, datetime.min.time())


def business_days_after(start, n, region=None):
    """The nth weekday after start (before it when n < 0), start not counted, less the region's holidays."""
    hol = HOLIDAYS.get(region, set())
    if n > 0:
        days = [x.date() for x in rrule(DAILY, dtstart=at(start + timedelta(1)), count=n * 2 + 40, byweekday=WEEKDAYS)]
        return [x for x in days if x not in hol][n - 1]
    days = [x.date() for x in rrule(DAILY, dtstart=at(start - timedelta(abs(n) * 2 + 40)), until=at(start - timedelta(1)),
                                    byweekday=WEEKDAYS)]
    return [x for x in days if x not in hol][n]


def business_days_between(a, b, region=None):
    """Weekdays after a up to and including b, less the region's holidays."""
    hol = HOLIDAYS.get(region, set())
    return len([x for x in rrule(DAILY, dtstart=at(a + timedelta(1)), until=at(b), byweekday=WEEKDAYS) if x.date() not in hol])


def months_between(a, b):
    """The largest n with a + n months <= b (relativedelta clamps to the month's end)."""
    n = 0
    while a + relativedelta(months=n + 1) <= b:
        n += 1
    return n


def zoned(dt):
    off = dt.utcoffset()
    if off == timedelta(0):
        offset = "Z"
    else:
        total = int(off.total_seconds() // 60)
        sign = "+" if total >= 0 else "-"
        offset = "%s%02d:%02d" % (sign, abs(total) // 60, abs(total) % 60)
    return dt.strftime("%Y-%m-%dT%H:%M") + offset + "[" + dt.tzinfo.key + "]"


R = d("2024-06-12")  # a Wednesday
RD = "dateutil.relativedelta"
DT = "datetime.date arithmetic"

# ---------------------------------------------------------------- yesterday, tomorrow, today
add("today", R, DT)
add("What is today's date?", R, DT)
add("yesterday", R - timedelta(1), DT)
add("Yesterday?", R - timedelta(1), DT)
add("tomorrow", R + timedelta(1), DT)
add("what's the date tomorrow", R + timedelta(1), DT)
add("the day after tomorrow", R + timedelta(2), DT)
add("day before yesterday", R - timedelta(2), DT)
add("tomorrow", d("2024-03-01"), DT, as_of="2024-02-29")
add("yesterday", d("2023-12-31"), DT, as_of="2024-01-01")
add("today in Tokyo", "2024-06-13", "zoneinfo Asia/Tokyo: 2024-06-12T20:00Z is 05:00 on 2024-06-13", as_of="2024-06-12T20:00Z")
add("tomorrow in New York", "2024-06-13", "zoneinfo America/New_York: 2024-06-13T02:00Z is 22:00 on 2024-06-12", as_of="2024-06-13T02:00Z")

# ---------------------------------------------------------------- in N days, N from now, ago
add("in 3 days", R + timedelta(3), DT)
add("in three days", R + timedelta(3), DT)
add("in 10 days", R + timedelta(10), DT)
add("in a week", R + timedelta(7), DT)
add("in 2 weeks", R + timedelta(14), DT)
add("in two weeks and 3 days", R + timedelta(17), DT)
add("in a fortnight", R + timedelta(14), DT)
add("in 3 months", R + relativedelta(months=3), RD)
add("in 1 month", d("2024-01-31") + relativedelta(months=1), RD + " (clamps to the month's end)", as_of="2024-01-31")
add("in a year", d("2024-02-29") + relativedelta(years=1), RD + " (clamps to the month's end)", as_of="2024-02-29")
add("3 days from now", R + timedelta(3), DT)
add("90 days from today", R + timedelta(90), DT)
add("a week from today", R + timedelta(7), DT)
add("six months from now", R + relativedelta(months=6), RD)
add("100 days from now", R + timedelta(100), DT)
add("in 3 days' time", R + timedelta(3), DT)
add("45 days ago", R - timedelta(45), DT)
add("two weeks ago", R - timedelta(14), DT)
add("a month ago", R - relativedelta(months=1), RD)
add("1 year 2 months ago", R - relativedelta(years=1, months=2), RD)
add("3 months ago", d("2024-05-31") - relativedelta(months=3), RD + " (clamps to the month's end)", as_of="2024-05-31")
add("in 2 hours", "2024-06-12T11:30Z", "datetime: 09:30Z + 2 h", as_of="2024-06-12T09:30Z")
add("3 hours ago", "2024-06-12T06:30Z", "datetime: 09:30Z - 3 h", as_of="2024-06-12T09:30Z")
add("in 5 days", "2024-06-17", DT, as_of="2024-06-12T23:30-04:00")

# ---------------------------------------------------------------- next / last / this WEEKDAY, on every weekday
DAYS = {"monday": MO, "tuesday": TU, "wednesday": WE, "thursday": TH, "friday": FR, "saturday": SA, "sunday": SU}
for offset, said in enumerate(["2024-06-10", "2024-06-11", "2024-06-12", "2024-06-13", "2024-06-14", "2024-06-15", "2024-06-16"]):
    ref = d(said)
    add("next Friday", ref + relativedelta(days=+1, weekday=FR(+1)), RD + ": days=+1, weekday=FR(+1), said on a " + NAMES[offset], as_of=said)
    add("last Friday", ref + relativedelta(days=-1, weekday=FR(-1)), RD + ": days=-1, weekday=FR(-1), said on a " + NAMES[offset], as_of=said)
    add("this Friday", ref + relativedelta(weekday=FR(+1)), RD + ": weekday=FR(+1), said on a " + NAMES[offset], as_of=said)
add("next monday", R + relativedelta(days=+1, weekday=MO(+1)), RD)
add("Next Tuesday?", R + relativedelta(days=+1, weekday=TU(+1)), RD)
add("next wednesday", R + relativedelta(days=+1, weekday=WE(+1)), RD + " (said on a Wednesday: a week later)")
add("last sunday", R + relativedelta(days=-1, weekday=SU(-1)), RD)
add("previous Thursday", R + relativedelta(days=-1, weekday=TH(-1)), RD)
add("coming Saturday", R + relativedelta(days=+1, weekday=SA(+1)), RD)
add("this sat", R + relativedelta(weekday=SA(+1)), RD)
add("next Fri", R + relativedelta(days=+1, weekday=FR(+1)), RD)
add("what is the date next Monday", R + relativedelta(days=+1, weekday=MO(+1)), RD)

# ---------------------------------------------------------------- until, since, between
add("days until 2024-12-25", (d("2024-12-25") - R).days, DT)
add("How many days until Christmas?", (d("2024-12-25") - R).days, DT + " (Christmas: 25 December, next occurrence)")
add("how many days until christmas 2025", (d("2025-12-25") - R).days, DT)
add("days until Christmas", (d("2025-12-25") - d("2024-12-26")).days, DT + " (after 25 December: the next year's)", as_of="2024-12-26")
add("days until December 25", (d("2024-12-25") - R).days, DT)
add("how many days are left until New Year's Eve", (d("2024-12-31") - R).days, DT)
add("days till halloween", (d("2024-10-31") - R).days, DT)
add("how long until 2024-07-04", (d("2024-07-04") - R).days, DT)
add("weeks until 2024-12-25", (d("2024-12-25") - R).days // 7, DT + ", whole weeks")
add("months until 2025-01-01", months_between(R, d("2025-01-01")), RD + ": largest n with as_of + n months <= date")
add("days since 2024-01-01", (R - d("2024-01-01")).days, DT)
add("how many days since January 1, 2024", (R - d("2024-01-01")).days, DT)
add("days since New Year's Day", (R - d("2024-01-01")).days, DT + " (latest 1 January)")
add("weeks since March 3, 2024", (R - d("2024-03-03")).days // 7, DT + ", whole weeks")
add("years since 1969-07-20", relativedelta(R, d("1969-07-20")).years, RD + ".years")
add("how long ago was 2024-05-01", (R - d("2024-05-01")).days, DT)
add("days until 2024-01-01", (d("2024-01-01") - R).days, DT + " (a past date: negative)")
add("days from today to 2024-08-01", (d("2024-08-01") - R).days, DT)
add("days between today and September 1, 2024", (d("2024-09-01") - R).days, DT)
add("days from 2024-01-01 to today", (R - d("2024-01-01")).days, DT)
add("days between March 1, 2024 and June 1, 2024", (d("2024-06-01") - d("2024-03-01")).days, DT)
add("How many days are there between 1 March 2024 and 1 June 2024?", (d("2024-06-01") - d("2024-03-01")).days, DT)
add("days from 2024-01-01 to 2024-12-25", (d("2024-12-25") - d("2024-01-01")).days, DT)
add("weeks between 2024-01-01 and 2024-03-01", (d("2024-03-01") - d("2024-01-01")).days // 7, DT + ", whole weeks")
add("months from January 31, 2024 to February 29, 2024", months_between(d("2024-01-31"), d("2024-02-29")), RD + ": largest n with date + n months <= to")
add("business days until 2024-06-28", business_days_between(R, d("2024-06-28")), "dateutil.rrule weekdays")

# ---------------------------------------------------------------- month ends, period edges
add("end of month", R + relativedelta(day=31), RD + ": day=31")
add("end of the month", d("2024-02-10") + relativedelta(day=31), RD + ": day=31", as_of="2024-02-10")
add("last day of the month", R + relativedelta(day=31), RD + ": day=31")
add("month end", R + relativedelta(day=31), RD + ": day=31")
add("end of next month", R + relativedelta(months=1, day=31), RD + ": months=1, day=31")
add("last day of next month", d("2024-01-15") + relativedelta(months=1, day=31), RD, as_of="2024-01-15")
add("end of last month", R + relativedelta(months=-1, day=31), RD)
add("start of next month", R + relativedelta(months=1, day=1), RD + ": months=1, day=1")
add("first day of next month", R + relativedelta(months=1, day=1), RD)
add("beginning of the month", R + relativedelta(day=1), RD)
add("end of February 2024", d("2024-02-01") + relativedelta(day=31), RD)
add("last day of February 2023", d("2023-02-01") + relativedelta(day=31), RD)
add("end of 2024-04", d("2024-04-01") + relativedelta(day=31), RD)
add("end of the year", date(R.year, 12, 31), DT)
add("start of next year", date(R.year + 1, 1, 1), DT)
add("end of 2025", date(2025, 12, 31), DT)
add("end of the quarter", R + relativedelta(month=6, day=31), RD + " (Q2 ends in June)")
add("end of next quarter", R + relativedelta(month=9, day=31), RD + " (Q3 ends in September)")
add("end of Q1 2025", d("2025-03-31"), RD)
add("start of the week", R + relativedelta(weekday=MO(-1)), RD + ": weekday=MO(-1), weeks start on Monday")
add("end of the week", R + relativedelta(weekday=SU(+1)), RD + ": weekday=SU(+1), weeks end on Sunday")
add("end of next week", R + relativedelta(weeks=1, weekday=SU(+1)), RD)
add("start of last week", R + relativedelta(weeks=-1, weekday=MO(-1)), RD)
add("end of the month of 2024-02-10", d("2024-02-10") + relativedelta(day=31), RD)

# ---------------------------------------------------------------- nth weekday of a month
add("first Monday of September 2024", date(2024, 9, 1) + relativedelta(weekday=MO(+1)), RD + ": day=1, weekday=MO(+1)")
add("the second Tuesday in March 2025", date(2025, 3, 1) + relativedelta(weekday=TU(+2)), RD + ": day=1, weekday=TU(+2)")
add("third Thursday of November 2024", date(2024, 11, 1) + relativedelta(weekday=TH(+3)), RD)
add("4th Thursday of November 2024", date(2024, 11, 1) + relativedelta(weekday=TH(+4)), RD + " (US Thanksgiving)")
add("last Friday of May 2024", date(2024, 5, 1) + relativedelta(day=31, weekday=FR(-1)), RD + ": day=31, weekday=FR(-1)")
add("last Monday of May 2025", date(2025, 5, 1) + relativedelta(day=31, weekday=MO(-1)), RD)
add("first Sunday of the month", R + relativedelta(day=1, weekday=SU(+1)), RD)
add("last friday of this month", R + relativedelta(day=31, weekday=FR(-1)), RD)
add("first Monday of next month", R + relativedelta(months=1, day=1, weekday=MO(+1)), RD)
add("the fifth Saturday of June 2024", date(2024, 6, 1) + relativedelta(weekday=SA(+5)), RD)
add("second Sunday of 2024-05", date(2024, 5, 1) + relativedelta(weekday=SU(+2)), RD)

# ---------------------------------------------------------------- business days
add("5 business days after 2024-03-01", business_days_after(d("2024-03-01"), 5), "dateutil.rrule weekdays")
add("10 business days after March 1, 2024", business_days_after(d("2024-03-01"), 10), "dateutil.rrule weekdays")
add("1 business day after 2024-06-14", business_days_after(d("2024-06-14"), 1), "dateutil.rrule weekdays (a Friday)")
add("1 business day after 2024-06-15", business_days_after(d("2024-06-15"), 1), "dateutil.rrule weekdays (a Saturday)")
add("3 business days before 2024-06-12", business_days_after(d("2024-06-12"), -3), "dateutil.rrule weekdays")
add("20 working days after 2024-06-12", business_days_after(d("2024-06-12"), 20), "dateutil.rrule weekdays")
add("2024-03-01 + 5 business days", business_days_after(d("2024-03-01"), 5), "dateutil.rrule weekdays")
add("in 5 business days", business_days_after(R, 5), "dateutil.rrule weekdays")
add("10 business days from now", business_days_after(R, 10), "dateutil.rrule weekdays")
add("3 business days ago", business_days_after(R, -3), "dateutil.rrule weekdays")
add("next business day", business_days_after(d("2024-06-14"), 1), "dateutil.rrule weekdays", as_of="2024-06-14")
add("business days from 2024-06-01 to 2024-06-30", business_days_between(d("2024-06-01"), d("2024-06-30")), "dateutil.rrule weekdays")
add("working days between 2024-03-01 and 2024-03-31", business_days_between(d("2024-03-01"), d("2024-03-31")), "dateutil.rrule weekdays")
for text, start, n, region in [
        ("3 business days after December 23, 2024 in GB-ENG", "2024-12-23", 3, "GB-ENG"),
        ("5 working days after 2024-03-27 in England", "2024-03-27", 5, "GB-ENG"),
        ("10 business days before 2024-12-31 in the UK", "2024-12-31", -10, "GB-ENG"),
        ("2 business days after 2024-08-02 in GB-SCT", "2024-08-02", 2, "GB-SCT"),
        ("5 business days after 2024-07-01 in US", "2024-07-01", 5, "US"),
        ("3 business days after 2024-11-27 in US", "2024-11-27", 3, "US"),
        ("next business day after 2024-12-24 in US", "2024-12-24", 1, "US"),
        ("5 business days after 2024-12-20 in US", "2024-12-20", 5, "US"),
        ("4 business days after 2024-05-08 in Germany", "2024-05-08", 4, "DE"),
        ("3 business days after 2024-05-29 in DE-BY", "2024-05-29", 3, "DE-BY"),
        ("2 business days after 2024-08-14 in FR", "2024-08-14", 2, "FR"),
        ("2025-04-17 + 2 business days in GB-ENG", "2025-04-17", 2, "GB-ENG")]:
    add(text, business_days_after(d(start), n, region), "dateutil.rrule weekdays less " + CALENDAR_SOURCES[region] + " (from memory)")
add("business days from 2024-12-20 to 2025-01-06 in US", business_days_between(d("2024-12-20"), d("2025-01-06"), "US"),
    "dateutil.rrule weekdays less " + CALENDAR_SOURCES["US"] + " (from memory)")
add("business days between 2024-03-28 and 2024-04-05 in GB-ENG", business_days_between(d("2024-03-28"), d("2024-04-05"), "GB-ENG"),
    "dateutil.rrule weekdays less " + CALENDAR_SOURCES["GB-ENG"] + " (from memory)")
add("business days until 2024-12-31 in GB-ENG", business_days_between(d("2024-12-20"), d("2024-12-31"), "GB-ENG"),
    "dateutil.rrule weekdays less " + CALENDAR_SOURCES["GB-ENG"] + " (from memory)", as_of="2024-12-20")
add("is 2024-07-04 a business day in US", "no", CALENDAR_SOURCES["US"] + " (from memory)")
add("is 2024-07-05 a business day in the US?", "yes", CALENDAR_SOURCES["US"] + " (from memory)")
add("Is 2024-12-26 a holiday in GB?", "yes", "GOV.UK bank holidays: Boxing Day (from memory)")
add("is 2024-01-02 a bank holiday in Scotland", "yes", CALENDAR_SOURCES["GB-SCT"] + ", 2 January (from memory)")
add("is 2024-01-02 a holiday in GB-ENG", "no", CALENDAR_SOURCES["GB-ENG"] + " (from memory)")
add("is 2024-06-15 a business day", "no", "datetime.date.weekday(): a Saturday")
add("is today a working day", "yes", "datetime.date.weekday(): a Wednesday")
add("is 2024-10-03 a holiday in Germany", "yes", CALENDAR_SOURCES["DE"] + ": German Unity Day (from memory)")

# ---------------------------------------------------------------- calendar facts as questions
add("is 2100 a leap year", "no", "Gregorian rule: divisible by 100, not by 400")
add("Is 2024 a leap year?", "yes", "Gregorian rule: divisible by 4")
add("was 1900 a leap year", "no", "Gregorian rule: divisible by 100, not by 400")
add("is 2000 a leap year", "yes", "Gregorian rule: divisible by 400")
add("will 2028 be a leap year", "yes", "Gregorian rule: divisible by 4")
add("how many days in February 2024", 29, "calendar.monthrange")
add("How many days are in February 2023?", 28, "calendar.monthrange")
add("days in April 2024", 30, "calendar.monthrange")
add("how many days does September 2024 have", 30, "calendar.monthrange")
add("number of days in 2024-02", 29, "calendar.monthrange")
add("what day of the week is 2024-07-04", NAMES[d("2024-07-04").weekday()], "datetime.date.weekday")
add("What day of the week was July 4, 1776?", NAMES[date(1776, 7, 4).weekday()], "datetime.date.weekday (proleptic Gregorian)")
add("what day is 25 December 2024", NAMES[date(2024, 12, 25).weekday()], "datetime.date.weekday")
add("which day was March 1, 2024", NAMES[date(2024, 3, 1).weekday()], "datetime.date.weekday")
add("day of the week of 1 January 2000", NAMES[date(2000, 1, 1).weekday()], "datetime.date.weekday")
add("what day of the year is 2024-03-01", d("2024-03-01").timetuple().tm_yday, "datetime.timetuple().tm_yday")
add("week number of 2024-03-01", "%d-W%02d-%d" % d("2024-03-01").isocalendar(), "datetime.date.isocalendar")
add("what week is December 30, 2024", "%d-W%02d-%d" % d("2024-12-30").isocalendar(), "datetime.date.isocalendar")
add("what quarter is 2024-08-15 in", "2024-Q3", "month 8 is in the third quarter")
add("quarter of November 3, 2024", "2024-Q4", "month 11 is in the fourth quarter")

# ---------------------------------------------------------------- English dates in arithmetic
add("90 days after March 1, 2024", d("2024-03-01") + timedelta(90), DT)
add("2 weeks from 2024-03-01", d("2024-03-01") + timedelta(14), DT)
add("30 days before 2024-03-15", d("2024-03-15") - timedelta(30), DT)
add("add 3 days to June 28, 2024", d("2024-06-28") + timedelta(3), DT)
add("subtract 2 weeks from 2024-01-10", d("2024-01-10") - timedelta(14), DT)
add("March 3, 2024 + 2 weeks", d("2024-03-03") + timedelta(14), DT)
add("3 March 2024 plus 1 month", d("2024-03-03") + relativedelta(months=1), RD)
add("31 January 2024 + 1 month", d("2024-01-31") + relativedelta(months=1), RD + " (clamps to the month's end)")
add("6 months after 2024-08-31", d("2024-08-31") + relativedelta(months=6), RD + " (clamps to the month's end)")
add("1 year after February 29, 2024", d("2024-02-29") + relativedelta(years=1), RD + " (clamps to the month's end)")
add("the 3rd of March 2024 + 10 days", d("2024-03-03") + timedelta(10), DT)
add("weekday 13/04/2024", NAMES[d("2024-04-13").weekday()], "datetime.date.weekday; 13 cannot be a month")
add("weekday 2024/03/04", NAMES[d("2024-03-04").weekday()], "datetime.date.weekday; year first is year-month-day")
add("weekday 07/07/2024", NAMES[d("2024-07-07").weekday()], "datetime.date.weekday; both readings agree")

# ---------------------------------------------------------------- zones by city
tokyo = datetime(2024, 3, 10, 9, 0, tzinfo=ZoneInfo("America/New_York")).astimezone(ZoneInfo("Asia/Tokyo"))
add("2024-03-10 09:00 New York to Tokyo", zoned(tokyo), "zoneinfo America/New_York to Asia/Tokyo", as_of=None)
london = datetime(2024, 7, 1, 15, 0, tzinfo=ZoneInfo("Asia/Tokyo")).astimezone(ZoneInfo("Europe/London"))
add("2024-07-01T15:00 Tokyo in London", zoned(london), "zoneinfo Asia/Tokyo to Europe/London", as_of=None)
sydney = datetime(2024, 11, 5, 21, 0, tzinfo=ZoneInfo("Europe/London")).astimezone(ZoneInfo("Australia/Sydney"))
add("convert 2024-11-05 9pm from London to Sydney", zoned(sydney), "zoneinfo Europe/London to Australia/Sydney", as_of=None)
la = datetime(2024, 6, 12, 9, 0, tzinfo=ZoneInfo("America/New_York")).astimezone(ZoneInfo("America/Los_Angeles"))
add("June 12, 2024 at 9am New York time to Los Angeles", zoned(la), "zoneinfo America/New_York to America/Los_Angeles", as_of=None)
now_tokyo = datetime(2024, 6, 12, 9, 30, tzinfo=ZoneInfo("UTC")).astimezone(ZoneInfo("Asia/Tokyo"))
add("what time is it in Tokyo", zoned(now_tokyo), "zoneinfo Asia/Tokyo", as_of="2024-06-12T09:30Z")
now_sp = datetime(2024, 6, 12, 9, 30, tzinfo=ZoneInfo("UTC")).astimezone(ZoneInfo("America/Sao_Paulo"))
add("current time in sao paulo", zoned(now_sp), "zoneinfo America/Sao_Paulo", as_of="2024-06-12T09:30Z")

# ---------------------------------------------------------------- more of what models and people write
add("What's the date 3 days from now?", R + timedelta(3), DT)
add("what date will it be in 2 weeks", R + timedelta(14), DT)
add("date 30 days from today", R + timedelta(30), DT)
add("what was the date 100 days ago", R - timedelta(100), DT)
add("a fortnight ago", R - timedelta(14), DT)
add("in 18 months", R + relativedelta(months=18), RD)
add("in 6 weeks", R + timedelta(42), DT)
add("tomorrow's date", R + timedelta(1), DT)
add("How many days until July 4th?", (d("2024-07-04") - R).days, DT + " (4 July, next occurrence)")
add("how many days till new year", (d("2025-01-01") - R).days, DT + " (1 January, next occurrence)")
add("days left until 2024-09-01", (d("2024-09-01") - R).days, DT)
add("how many weeks until Christmas", (d("2024-12-25") - R).days // 7, DT + ", whole weeks")
add("how many business days until 2024-07-01", business_days_between(R, d("2024-07-01")), "dateutil.rrule weekdays")
add("How many days has it been since 2024-01-01?", (R - d("2024-01-01")).days, DT)
add("how many days ago was 2024-05-01", (R - d("2024-05-01")).days, DT)
add("When is the first Monday of October 2024?", date(2024, 10, 1) + relativedelta(weekday=MO(+1)), RD)
add("second Monday of October 2024", date(2024, 10, 1) + relativedelta(weekday=MO(+2)), RD)
add("the last Thursday of November 2024", date(2024, 11, 1) + relativedelta(day=31, weekday=TH(-1)), RD)
add("when is the end of the month", R + relativedelta(day=31), RD)
add("the last day of this month", R + relativedelta(day=31), RD)
add("15 business days after June 3rd, 2024", business_days_after(d("2024-06-03"), 15), "dateutil.rrule weekdays")
add("what is 10 business days from 2024-06-03", business_days_after(d("2024-06-03"), 10), "dateutil.rrule weekdays")
add("5 working days from today", business_days_after(R, 5), "dateutil.rrule weekdays")
add("what's 45 days before July 4, 2024", d("2024-07-04") - timedelta(45), DT)
add("July 4, 2024 minus 45 days", d("2024-07-04") - timedelta(45), DT)
add("Dec 25 2024 - 3 weeks", d("2024-12-25") - timedelta(21), DT)
add("how many days between Jan 1 2024 and Mar 1 2024", (d("2024-03-01") - d("2024-01-01")).days, DT)
add("number of days from 2024-02-01 to 2024-03-01", (d("2024-03-01") - d("2024-02-01")).days, DT)
add("years between 1990-05-15 and 2024-06-12", relativedelta(d("2024-06-12"), d("1990-05-15")).years, RD + ".years")
add("day of the week for 2025-01-01", NAMES[d("2025-01-01").weekday()], "datetime.date.weekday")
add("is 2023 a leap year?", "no", "Gregorian rule: not divisible by 4")
add("days in feb 2100", 28, "calendar.monthrange (2100 is no leap year)")
add("what week number is 2024-06-12", "%d-W%02d-%d" % d("2024-06-12").isocalendar(), "datetime.date.isocalendar")
add("2024-06-12T09:00 London to New York", zoned(datetime(2024, 6, 12, 9, 0, tzinfo=ZoneInfo("Europe/London")).astimezone(ZoneInfo("America/New_York"))),
    "zoneinfo Europe/London to America/New_York", as_of=None)
add("now in New York", zoned(datetime(2024, 6, 12, 9, 30, tzinfo=ZoneInfo("UTC")).astimezone(ZoneInfo("America/New_York"))),
    "zoneinfo America/New_York", as_of="2024-06-12T09:30Z")
add("the time in Sydney", zoned(datetime(2024, 6, 12, 9, 30, tzinfo=ZoneInfo("UTC")).astimezone(ZoneInfo("Australia/Sydney"))),
    "zoneinfo Australia/Sydney", as_of="2024-06-12T09:30Z")
add("next Friday", d("2025-01-03"), RD + ": days=+1, weekday=FR(+1), across a year end", as_of="2024-12-31")
add("in 2 days", d("2024-03-01"), DT + " (across 29 February)", as_of="2024-02-28")
add("end of the month", d("2023-02-28"), RD + ": day=31 in a common year", as_of="2023-02-14")
add("last Friday of the month", R + relativedelta(day=31, weekday=FR(-1)), RD)
add("days since Christmas", (d("2025-01-10") - d("2024-12-25")).days, DT + " (latest 25 December)", as_of="2025-01-10")
add("3 days after 2024-02-27", d("2024-03-01"), DT)

# ---------------------------------------------------------------- version 1 forms, still answered
add("45 days ago", R - timedelta(45), DT)
add("2024-01-31 + P1M", d("2024-01-31") + relativedelta(months=1), RD, as_of=None)
add("days from 2024-01-01 to 2024-12-25", (d("2024-12-25") - d("2024-01-01")).days, DT, as_of=None)
add("weekday 2024-03-01", NAMES[d("2024-03-01").weekday()], "datetime.date.weekday", as_of=None)
add("leap year 2024", "yes", "Gregorian rule", as_of=None)
add("days in month 2023-02", 28, "calendar.monthrange", as_of=None)

# ---------------------------------------------------------------- refused: ambiguous, with the readings
refuse("weekday 03/04/2024", "ambiguous_date", "month/day and day/month give different dates",
       readings=["2024-03-04 (month/day)", "2024-04-03 (day/month)"])
refuse("Friday", "ambiguous_date", "a weekday alone: this, next or last", readings=["this Friday", "next Friday", "last Friday"])
refuse("today in IST", "ambiguous_date", "IST: India, Irish or Israel Standard Time",
       readings=["Asia/Kolkata (India)", "Europe/Dublin (Irish Standard Time)", "Asia/Jerusalem (Israel)"])
refuse("2024-03-10 09:00 CST to UTC", "ambiguous_date", "CST: US Central, China or Cuba",
       readings=["America/Chicago (US Central)", "Asia/Shanghai (China Standard Time)", "America/Havana (Cuba)"], as_of=None)

# ---------------------------------------------------------------- refused: no single answer, or no such thing
refuse("next week", "syntax_error", "a week is a span; the error names start of next week")
refuse("this weekend", "syntax_error", "two days; the error names this Saturday")
refuse("end of March", "syntax_error", "no year given")
refuse("weekday 3/4/24", "invalid_date", "a two-digit year: the century is a guess")
refuse("February 30, 2024 + 1 day", "invalid_date", "February 2024 has 29 days")
refuse("is 2024-07-04 a holiday in XX", "unknown_region", "XX is no ISO 3166 country")
refuse("when pigs fly", "syntax_error", "no date question")

# The structured form of a phrase of each new kind: the same call without text. The test checks that
# both forms give the same canonical arguments and the expected answer.
STRUCTURED = {
    "yesterday": {"op": "ago", "duration": "P1D"},
    "tomorrow": {"op": "from_now", "duration": "P1D"},
    "in 3 days": {"op": "from_now", "duration": "P3D"},
    "in two weeks and 3 days": {"op": "from_now", "duration": "P2W3D"},
    "3 days from now": {"op": "from_now", "duration": "P3D"},
    "six months from now": {"op": "from_now", "duration": "P6M"},
    "in 1 month": {"op": "from_now", "duration": "P1M"},
    "two weeks ago": {"op": "ago", "duration": "P2W"},
    "in 2 hours": {"op": "from_now", "duration": "PT2H"},
    "today in Tokyo": {"op": "today", "zone": "Tokyo"},
    "next Friday": {"op": "relative_weekday", "weekday": "friday", "which": "next"},
    "last Friday": {"op": "relative_weekday", "weekday": "Fri", "which": "last"},
    "this Friday": {"op": "relative_weekday", "weekday": "FRIDAY", "which": "this"},
    "days until 2024-12-25": {"op": "until", "to": "2024-12-25"},
    "How many days until Christmas?": {"op": "until", "to": "--12-25", "unit": "days"},
    "days until December 25": {"op": "until", "to": "December 25"},
    "weeks until 2024-12-25": {"op": "until", "to": "2024-12-25", "unit": "weeks"},
    "days since 2024-01-01": {"op": "since", "date": "2024-01-01"},
    "weeks since March 3, 2024": {"op": "since", "date": "March 3, 2024", "unit": "weeks"},
    "business days until 2024-12-31 in GB-ENG": {"op": "until", "to": "2024-12-31", "unit": "business_days", "region": "gb-eng"},
    "end of month": {"op": "end_of", "period": "month"},
    "end of next month": {"op": "end_of", "period": "month", "shift": 1},
    "start of last week": {"op": "start_of", "period": "week", "shift": -1},
    "end of February 2024": {"op": "end_of", "period": "month", "date": "2024-02"},
    "end of 2025": {"op": "end_of", "period": "year", "date": "2025"},
    "end of the quarter": {"op": "end_of", "period": "quarter", "shift": 0},
    "first Monday of September 2024": {"op": "nth_weekday", "weekday": "monday", "n": 1, "date": "2024-09"},
    "last Friday of May 2024": {"op": "nth_weekday", "weekday": "friday", "n": -1, "date": "May 2024"},
    "first Monday of next month": {"op": "nth_weekday", "weekday": "monday", "n": 1, "shift": 1},
    "5 business days after 2024-03-01": {"op": "add_business_days", "date": "2024-03-01", "days": 5},
    "3 business days before 2024-06-12": {"op": "add_business_days", "date": "2024-06-12", "days": -3},
    "in 5 business days": {"op": "add_business_days", "days": 5},
    "3 business days after December 23, 2024 in GB-ENG": {"op": "add_business_days", "date": "2024-12-23", "days": 3, "region": "GB-ENG"},
    "4 business days after 2024-05-08 in Germany": {"op": "add_business_days", "date": "2024-05-08", "days": 4, "region": "DE"},
    "business days from 2024-12-20 to 2025-01-06 in US": {"op": "between", "date": "2024-12-20", "to": "2025-01-06", "unit": "business_days", "region": "US"},
    "is 2024-07-04 a business day in US": {"op": "is_business_day", "date": "2024-07-04", "region": "US"},
    "Is 2024-12-26 a holiday in GB?": {"op": "is_holiday", "date": "2024-12-26", "region": "GB"},
    "is 2100 a leap year": {"op": "leap_year", "date": "2100"},
    "how many days in February 2024": {"op": "days_in_month", "date": "2024-02"},
    "What day of the week was July 4, 1776?": {"op": "weekday", "date": "1776-07-04"},
    "week number of 2024-03-01": {"op": "iso_week", "date": "2024-03-01"},
    "90 days after March 1, 2024": {"op": "add", "date": "March 1, 2024", "duration": "P90D"},
    "2024-03-10 09:00 New York to Tokyo": {"op": "convert_zone", "date": "2024-03-10T09:00", "zone": "America/New_York", "to": "Tokyo"},
    "what time is it in Tokyo": {"op": "now", "zone": "Asia/Tokyo"},
}

out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "dates.jsonl")
with open(out, "w", encoding="utf-8") as f:
    for case in cases:
        if "expect" in case:
            case["expect"] = str(case["expect"])
        if case["text"] in STRUCTURED:
            case["structured"] = STRUCTURED[case["text"]]
        f.write(json.dumps(case, ensure_ascii=False) + "\n")
print(len(cases), "cases written to", out)
