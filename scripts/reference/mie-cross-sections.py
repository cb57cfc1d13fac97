"""Independent reference cross-sections Q(1)*, Q(2)* of the Mie lambda-6 potential for shared/physics/mie-collision-integrals.test.ts
(scipy QUADPACK, written separately from the TypeScript code; run: python3 scripts/reference/mie-cross-sections.py).
chi = pi - 2 beta * int_0^1 du / sqrt(F(u)), u = r_m/r, with QAWS algebraic weight (1-u)^(-1/2);
Q(l) by adaptive quad over b (split at orbiting b_o, found by brentq on the effective-potential conditions);
Q(1)* = 2 int (1 - cos chi) b db and Q(2)* = 3 int sin^2 chi b db (1 for rigid spheres of diameter sigma)."""
import sys, math, json, time
from scipy.integrate import quad
from scipy.optimize import brentq

def make(n):
    C = (n / (n - 6.0)) * (n / 6.0) ** (6.0 / (n - 6.0))
    u = lambda r: C * (r ** -n - r ** -6)
    du = lambda r: C * (-n * r ** (-n - 1) + 6 * r ** -7)
    # Orbiting curve E(r) = u + r u'/2, maximised numerically on r > r_min.
    Eorb = lambda r: u(r) + 0.5 * r * du(r)
    # dE/dr = 0: bracket on r in (1, 3)
    dE = lambda r: (Eorb(r * (1 + 1e-7)) - Eorb(r * (1 - 1e-7))) / (2e-7 * r)
    rstar = brentq(dE, 1.0001, 3.0, xtol=1e-14)
    Eo = Eorb(rstar)
    def orbit(E):
        if E >= Eo:
            return None
        ro = brentq(lambda r: Eorb(r) - E, rstar, 1e3, xtol=1e-15)
        bo = math.sqrt(ro ** 3 * du(ro) / (2 * E))
        return ro, bo
    def rmin(b, E, orb):
        F = lambda r: 1 - b * b / (r * r) - u(r) / E
        hi = max(b, 1.0) * 1.5 + 2
        if orb and b < orb[1]:
            hi = orb[0]
        lo = 0.05
        while F(lo) > 0: lo *= 0.5
        if orb and b > orb[1]:
            lo = orb[0]
        while F(hi) < 0: hi *= 1.5
        return brentq(F, lo, hi, xtol=1e-15, rtol=1e-15)
    def chi(b, E, orb):
        if b == 0: return math.pi
        rm = rmin(b, E, orb)
        beta = b / rm
        def f(s):
            if s >= 1: s = 1 - 1e-16
            Fv = 1 - beta * beta * s * s - u(rm / s) / E if s > 0 else 1.0
            return math.sqrt(max((1 - s) / Fv, 0)) if Fv > 0 else 0.0
        val, err = quad(f, 0, 1, weight='alg', wvar=(0, -0.5), epsabs=1e-12, epsrel=1e-11, limit=400)
        return math.pi - 2 * beta * val
    def Q(E):
        orb = orbit(E)
        g1 = lambda b: (1 - math.cos(chi(b, E, orb))) * b
        g2 = lambda b: math.sin(chi(b, E, orb)) ** 2 * b
        B = 6.0 if not orb else max(6.0, 2 * orb[1])
        res = [0.0, 0.0]
        pts = [orb[1]] if orb else None
        for k, g in enumerate((g1, g2)):
            if orb:
                bo = orb[1]
                a = quad(g, 0, bo, epsabs=1e-10, epsrel=1e-8, limit=400)[0]
                c = quad(g, bo, B, epsabs=1e-10, epsrel=1e-8, limit=400)[0]
                inner = a + c
            else:
                inner = quad(g, 0, B, epsabs=1e-10, epsrel=1e-8, limit=400)[0]
            # Beyond b = 40 sigma, 1 - cos chi ~ chi^2/2 ~ b^-12 contributes below 1e-12; integrating further only adds
            # the rounding noise of chi = pi - 2 beta I.
            tail = quad(g, B, 40.0, epsabs=1e-12, epsrel=1e-8, limit=200)[0]
            res[k] = inner + tail
        return 2 * res[0], 3 * res[1]
    return Q, Eo

if __name__ == '__main__':
    for n, E in [(12, 1.0), (8, 0.3), (8, 3.0), (16, 0.5), (16, 5.0), (20, 1.2), (24, 0.2), (36, 2.0), (36, 50.0)]:
        t0 = time.time()
        Q, Eo = make(float(n))
        q1, q2 = Q(E)
        print(json.dumps({'repulsiveExponent': n, 'reducedEnergy': E, 'q1': q1, 'q2': q2, 'orbitingEnergy': Eo, 'seconds': time.time() - t0}), flush=True)
