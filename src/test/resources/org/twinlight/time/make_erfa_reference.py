"""Reference values for twinlight's time-scale tests, computed with the IAU SOFA routines as
packaged by ERFA (Python binding pyerfa 2.0.0.1, Debian package python3-erfa).

IAU-standard route for a geocentric observer:
  UTC -> TAI (eraUtctai) -> TT (eraTaitt) -> TDB = TT + eraDtdb(TT; ut, 0, 0, 0) (geocentric)
  Earth heliocentric and barycentric position: eraEpv00(TDB) (au, BCRS/ICRS axes)
  BJD_TDB = TDB + (r_bary . n) au/c ;  HJD_UTC = UTC + (r_helio . n) au/c

Run: python3 make_erfa_reference.py > erfa-reference.csv
"""
import math
import random

import erfa

AU_LIGHT_TIME_S = 149597870700.0 / 299792458.0
random.seed(20261202)

print("# made by make_erfa_reference.py with pyerfa", erfa.__version__)
print("# mjd_utc,ra_deg,dec_deg,bmjd_tdb,hmjd_utc,tdb_minus_tt_s,"
      "helio_x_au,helio_y_au,helio_z_au,bary_x_au,bary_y_au,bary_z_au")


def row(day, frac, ra, dec):
    u1, u2 = 2400000.5, day + frac
    a1, a2 = erfa.utctai(u1, u2)
    t1, t2 = erfa.taitt(a1, a2)
    dtdb = erfa.dtdb(t1, t2, frac, 0.0, 0.0, 0.0)
    b1, b2 = t1, t2 + dtdb / 86400.0
    pvh, pvb = erfa.epv00(b1, b2)
    n = (math.cos(math.radians(dec)) * math.cos(math.radians(ra)),
         math.cos(math.radians(dec)) * math.sin(math.radians(ra)),
         math.sin(math.radians(dec)))
    rh = [float(pvh[0][i]) for i in range(3)]
    rb = [float(pvb[0][i]) for i in range(3)]
    dh = sum(rh[i] * n[i] for i in range(3)) * AU_LIGHT_TIME_S
    db = sum(rb[i] * n[i] for i in range(3)) * AU_LIGHT_TIME_S
    bmjd = (b1 - 2400000.5) + b2 + db / 86400.0
    hmjd = day + frac + dh / 86400.0
    print("%.10f,%.9f,%.9f,%.12f,%.12f,%.9e,%.12f,%.12f,%.12f,%.12f,%.12f,%.12f" % (
        day + frac, ra, dec, bmjd, hmjd, dtdb, rh[0], rh[1], rh[2], rb[0], rb[1], rb[2]))


for k in range(200):
    day = random.randint(47892, 64328)  # 1990-01-01 .. 2035-01-01 (MJD)
    frac = round(random.random(), 10)
    ra = random.uniform(0.0, 360.0)
    dec = math.degrees(math.asin(random.uniform(-1.0, 1.0)))
    row(day, frac, ra, dec)

# the time command's test case: MJD_UTC 59000.25 and 59000.30 at RA 05:34:31.94, Dec +22:00:52.2
for frac in (0.25, 0.30):
    row(59000, frac, (5 + 34 / 60 + 31.94 / 3600) * 15, 22 + 0 / 60 + 52.2 / 3600)
