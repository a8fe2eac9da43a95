using System.Runtime.CompilerServices;

namespace Lightfold.Lensing;

/// <summary>Finds every image of a point source behind a <see cref="SieShearLens"/>; the fast core used in loops.</summary>
/// <remarks>
/// Because the SIE deflection depends only on the direction φ of θ, writing θ = r u(φ) turns the lens
/// equation into M θ = β + α(φ) with M = I − Γ (Γ the external-shear matrix). Images are the roots of the
/// scalar function f(φ) = (M u) × (β + α(φ)) with r = (β + α)·(M u)/|M u|² &gt; 0, the polar reduction used
/// for isothermal lenses (e.g. Keeton &amp; Kochanek 1998, ApJ 495, 157; from memory). f and f′ are sampled at
/// 48 angles; a cubic Hermite model of each interval flags extrema whose dip might hide a pair of roots
/// near a caustic, and those extrema are located exactly (root of f′) before deciding. Each root is refined by
/// safeguarded Newton iteration in φ and then polished in 2-D until |β − (θ − α(θ))| &lt; 1e-10 θ_E.
/// Allocation-free. Use <see cref="LensEquation.Solve"/> outside hot loops for a throwing, list-returning form.
/// </remarks>
public static class ImageFinder
{
    /// <summary>Capacity a caller's span should have (the singular SIE plus shear has at most 4 images; margin for caustics).</summary>
    public const int MaxImages = 6;

    const int Samples = 48;
    const double Offset = 0.0123456789;   // keeps symmetric images off the sample nodes
    static readonly double[] NodeCos = new double[Samples + 1];
    static readonly double[] NodeSin = new double[Samples + 1];

    static ImageFinder()
    {
        for (int i = 0; i <= Samples; i++)
        {
            (NodeSin[i], NodeCos[i]) = Math.SinCos(Offset + 2.0 * Math.PI * i / Samples);
        }
    }

    /// <summary>Finds all images of the source at (β_x, β_y) [arcsec, sky frame].</summary>
    /// <param name="lens">The lens.</param>
    /// <param name="betaXArcsec">Source East offset.</param>
    /// <param name="betaYArcsec">Source North offset.</param>
    /// <param name="found">Receives the images ordered by arrival time (first = 0); needs <see cref="MaxImages"/> slots.</param>
    /// <param name="count">Number of images written.</param>
    /// <param name="status">Regular, on a caustic, or an Einstein ring.</param>
    /// <returns>False only if <paramref name="found"/> was too small or the source position is not finite.</returns>
    public static bool TryFindImages(SieShearLens lens, double betaXArcsec, double betaYArcsec,
        Span<LensedImage> found, out int count, out ImageSetStatus status)
    {
        var kernel = new SieKernel(lens);
        return TryFindImages(in kernel, betaXArcsec, betaYArcsec, found, out count, out status);
    }

    internal static bool TryFindImages(in SieKernel k, double betaXArcsec, double betaYArcsec,
        Span<LensedImage> found, out int count, out ImageSetStatus status)
    {
        count = 0;
        status = ImageSetStatus.Regular;
        if (!double.IsFinite(betaXArcsec) || !double.IsFinite(betaYArcsec) || found.Length < MaxImages) return false;
        k.ToLens(betaXArcsec, betaYArcsec, out double bx, out double by);
        if (bx == 0 && by == 0 && k.Round && k.G1 == 0 && k.G2 == 0)
        {
            status = ImageSetStatus.Ring;
            return true;
        }

        var solver = new Solver(in k, bx, by);
        Span<double> roots = stackalloc double[16];
        Span<bool> merged = stackalloc bool[16];
        int nRoots = 0;

        double fa = 0, da = 0;
        solver.Eval(NodeCos[0], NodeSin[0], out fa, out da);
        double a = Offset;
        for (int i = 1; i <= Samples; i++)
        {
            double b = Offset + 2.0 * Math.PI * i / Samples;
            double fb, db;
            if (i == Samples) solver.Eval(NodeCos[0], NodeSin[0], out fb, out db);
            else solver.Eval(NodeCos[i], NodeSin[i], out fb, out db);
            if (fa == 0 && nRoots < roots.Length) { merged[nRoots] = false; roots[nRoots++] = a; }
            solver.Interval(a, b, fa, fb, da, db, 0, roots, merged, ref nRoots);
            a = b;
            fa = fb;
            da = db;
        }

        for (int i = 0; i < nRoots && count < found.Length; i++)
        {
            if (solver.MakeImage(roots[i], out var image))
            {
                if (merged[i]) status = ImageSetStatus.OnCaustic;
                found[count++] = image;
            }
        }

        // Order by arrival and make the Fermat potential relative to the first image.
        var slice = found[..count];
        slice.Sort(static (p, q) => p.FermatPotentialArcsec2.CompareTo(q.FermatPotentialArcsec2));
        if (count > 0)
        {
            double first = slice[0].FermatPotentialArcsec2;
            for (int i = 0; i < count; i++)
                slice[i] = slice[i] with { RelativeFermatArcsec2 = slice[i].FermatPotentialArcsec2 - first };
            // Rotate into the sky frame last (positions only; scalars are frame-free).
            for (int i = 0; i < count; i++)
            {
                k.ToSky(slice[i].XArcsec, slice[i].YArcsec, out double x, out double y);
                slice[i] = slice[i] with { XArcsec = x, YArcsec = y };
            }
        }
        return true;
    }

    ref struct Solver
    {
        readonly SieKernel k;
        readonly double bx, by, m11, m22, m12, scale;

        public Solver(in SieKernel kernel, double betaX, double betaY)
        {
            k = kernel;
            bx = betaX;
            by = betaY;
            m11 = 1.0 - k.G1;
            m22 = 1.0 + k.G1;
            m12 = -k.G2;
            scale = k.ThetaE + Math.Sqrt(bx * bx + by * by);
        }

        /// <summary>f(φ) and f′(φ) at the direction (c, s).</summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public readonly void Eval(double c, double s, out double f, out double df)
        {
            k.UnitDirection(c, s, out double ax, out double ay, out double hxx, out double hyy, out double hxy);
            double mux = m11 * c + m12 * s, muy = m12 * c + m22 * s;
            double mpx = -m11 * s + m12 * c, mpy = -m12 * s + m22 * c;   // M u⊥
            double wx = bx + ax, wy = by + ay;
            double dax = -hxx * s + hxy * c, day = -hxy * s + hyy * c;   // dα/dφ = H u⊥
            f = mux * wy - muy * wx;
            df = mpx * wy - mpy * wx + mux * day - muy * dax;
        }

        readonly void EvalAt(double phi, out double f, out double df)
        {
            (double s, double c) = Math.SinCos(phi);
            Eval(c, s, out f, out df);
        }

        /// <summary>Examines [a, b] for roots of f, located from the cubic Hermite model of f on it.</summary>
        public readonly void Interval(double a, double b, double fa, double fb, double da, double db, int depth,
            Span<double> roots, Span<bool> merged, ref int n)
        {
            double h = b - a;
            bool signChange = fa * fb < 0;
            // p′(t) = A t² + B t + C for the Hermite cubic p on t ∈ [0, 1].
            double qa = 6 * (fa - fb) + 3 * h * (da + db);
            double qb = -6 * (fa - fb) - 4 * h * da - 2 * h * db;
            double qc = h * da;
            int nExt = ModelExtrema(qa, qb, qc, out double t1, out double t2);

            if (nExt == 0 || (nExt == 1 && signChange))
            {
                if (signChange) Add(RefineRoot(a, b, fa, fb), false, roots, merged, ref n);
                return;
            }
            if (nExt == 2)
            {
                // A wiggle inside the interval (two extrema): look closer at each half.
                if (depth >= 12)
                {
                    if (signChange) Add(RefineRoot(a, b, fa, fb), false, roots, merged, ref n);
                    return;
                }
                double m = 0.5 * (a + b);
                EvalAt(m, out double fm, out double dm);
                if (fm == 0) Add(m, false, roots, merged, ref n);
                Interval(a, m, fa, fm, da, dm, depth + 1, roots, merged, ref n);
                Interval(m, b, fm, fb, dm, db, depth + 1, roots, merged, ref n);
                return;
            }
            // One extremum inside and no sign change: could it dip through zero?
            double pe = Hermite(t1, h, fa, fb, da, db);
            if (Math.Abs(pe) > 1e-3 * scale && pe * fa > 0) return;
            double phiE = DerivativeRoot(a, b, da, db);
            EvalAt(phiE, out double fe, out _);
            if (Math.Abs(fe) <= 1e-13 * scale)
                Add(phiE, true, roots, merged, ref n);           // two images merged on the critical curve
            else if (fe * fa < 0)
            {
                Add(RefineRoot(a, phiE, fa, fe), false, roots, merged, ref n);
                Add(RefineRoot(phiE, b, fe, fb), false, roots, merged, ref n);
            }
        }

        static void Add(double phi, bool isMerged, Span<double> roots, Span<bool> merged, ref int n)
        {
            if (n >= roots.Length) return;
            merged[n] = isMerged;
            roots[n++] = phi;
        }

        static int ModelExtrema(double qa, double qb, double qc, out double t1, out double t2)
        {
            t1 = t2 = double.NaN;
            int n = 0;
            if (Math.Abs(qa) < 1e-300)
            {
                if (qb != 0)
                {
                    double t = -qc / qb;
                    if (t > 0 && t < 1) { t1 = t; n = 1; }
                }
                return n;
            }
            double disc = qb * qb - 4 * qa * qc;
            if (disc < 0) return 0;
            double sq = Math.Sqrt(disc);
            double q = -0.5 * (qb + (qb >= 0 ? sq : -sq));
            double r1 = q / qa, r2 = q != 0 ? qc / q : double.NaN;
            if (r1 > 0 && r1 < 1) { t1 = r1; n++; }
            if (r2 > 0 && r2 < 1 && r2 != r1) { if (n == 0) t1 = r2; else t2 = r2; n++; }
            return n;
        }

        static double Hermite(double t, double h, double fa, double fb, double da, double db)
        {
            double t2 = t * t, t3 = t2 * t;
            return (2 * t3 - 3 * t2 + 1) * fa + (t3 - 2 * t2 + t) * h * da + (-2 * t3 + 3 * t2) * fb + (t3 - t2) * h * db;
        }

        /// <summary>Root of f in [a, b] (f(a) f(b) &lt; 0): Newton steps kept inside a shrinking bracket.</summary>
        readonly double RefineRoot(double a, double b, double fa, double fb)
        {
            if (fa > 0) { (a, b) = (b, a); (fa, fb) = (fb, fa); }   // now f(a) < 0 < f(b)
            double x = Math.Abs(fa) < Math.Abs(fb) ? a : b;
            EvalAt(x, out double fx, out double dx);
            for (int it = 0; it < 100; it++)
            {
                if (fx == 0) return x;
                if (fx < 0) a = x; else b = x;
                double next = x - fx / dx;
                bool inside = (next - a) * (next - b) < 0;
                if (!inside || !double.IsFinite(next)) next = 0.5 * (a + b);
                if (Math.Abs(next - x) <= 1e-15 * (1.0 + Math.Abs(x)) || Math.Abs(b - a) <= 4e-16 * (1.0 + Math.Abs(x))) return next;
                x = next;
                EvalAt(x, out fx, out dx);
            }
            return x;
        }

        /// <summary>Root of f′ in [a, b] where f′(a) f′(b) &lt; 0 (Illinois regula falsi; Dowell &amp; Jarratt 1971, BIT 11, 168).</summary>
        readonly double DerivativeRoot(double a, double b, double da, double db)
        {
            int side = 0;
            double x = 0.5 * (a + b);
            for (int it = 0; it < 100; it++)
            {
                x = (a * db - b * da) / (db - da);
                if (!(x > Math.Min(a, b) && x < Math.Max(a, b))) x = 0.5 * (a + b);
                EvalAt(x, out _, out double dx);
                if (dx == 0 || Math.Abs(b - a) < 1e-15 * (1 + Math.Abs(x))) return x;
                if (dx * db > 0)
                {
                    b = x; db = dx;
                    if (side == -1) da *= 0.5;
                    side = -1;
                }
                else
                {
                    a = x; da = dx;
                    if (side == 1) db *= 0.5;
                    side = 1;
                }
            }
            return x;
        }

        /// <summary>Turns a root φ into an image (lens frame), polishing it in 2-D; false if r ≤ 0 (no image there).</summary>
        public readonly bool MakeImage(double phi, out LensedImage image)
        {
            image = default;
            (double s, double c) = Math.SinCos(phi);
            k.UnitDirection(c, s, out double ax, out double ay, out _, out _, out _);
            double mux = m11 * c + m12 * s, muy = m12 * c + m22 * s;
            double r = ((bx + ax) * mux + (by + ay) * muy) / (mux * mux + muy * muy);
            if (!(r > 1e-12 * k.ThetaE)) return false;
            double x = r * c, y = r * s;
            LensPoint p = k.EvaluateLens(x, y);
            double residual = Residual(x, y, p);
            for (int it = 0; it < 8 && residual > 1e-12 * k.ThetaE; it++)
            {
                // Newton step on β = θ − α(θ): Δθ = A⁻¹ (β − θ + α), A = I − H.
                double ex = bx - x + p.AlphaX, ey = by - y + p.AlphaY;
                double a11 = 1 - p.Hxx, a22 = 1 - p.Hyy, a12 = -p.Hxy, det = a11 * a22 - a12 * a12;
                if (det == 0) break;
                double nx = x + (a22 * ex - a12 * ey) / det, ny = y + (-a12 * ex + a11 * ey) / det;
                var np = k.EvaluateLens(nx, ny);
                double nres = Residual(nx, ny, np);
                if (!(nres < residual)) break;
                (x, y, p, residual) = (nx, ny, np, nres);
            }
            double det0 = p.JacobianDeterminant;
            // On a critical curve det → 0: cap |μ| at 1e12 rather than report an infinity.
            if (Math.Abs(det0) < 1e-12) det0 = det0 < 0 ? -1e-12 : 1e-12;
            double dxs = x - bx, dys = y - by;
            double tau = 0.5 * (dxs * dxs + dys * dys) - p.Potential;
            image = new LensedImage(x, y, 1.0 / det0, tau, 0.0, k.Kappa(x, y), p.ShearMagnitude, residual);
            return true;
        }

        readonly double Residual(double x, double y, in LensPoint p)
        {
            double ex = bx - (x - p.AlphaX), ey = by - (y - p.AlphaY);
            return Math.Sqrt(ex * ex + ey * ey);
        }
    }
}
