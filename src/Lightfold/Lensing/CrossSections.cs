namespace Lightfold.Lensing;

/// <summary>Source-plane areas with at least two and at least four images, in units of θ_E².</summary>
/// <param name="AtLeastTwo">Area inside the cut or the tangential caustic (multiply imaged).</param>
/// <param name="AtLeastFour">Area inside both (four images).</param>
/// <param name="MaxRadius">Largest distance from the lens centre of any point of that region.</param>
public readonly record struct CrossSection(double AtLeastTwo, double AtLeastFour, double MaxRadius);

/// <summary>Cross-sections of SIE + shear lenses: exact from the curves, or fast from a cached lookup.</summary>
/// <remarks>
/// In source-plane polar coordinates (R, ψ) about the lens centre, each of 4096 rays is intersected with the
/// sampled cut and tangential caustic; the even–odd rule turns the sorted crossings into the stretches of the
/// ray inside each curve (tilted cusps make the regions slightly non-star-shaped, so a ray may cross a curve
/// three times). A source inside the cut or the caustic has ≥ 2 images, inside both ≥ 4 (inside the caustic
/// but outside the cut, three: the naked-cusp case). Area = Σ_rays Δψ ∫ R dR over those stretches.
/// Everything scales as θ_E², so only (q, γ, shear angle relative to the major axis) matter.
/// </remarks>
public static class CrossSections
{
    const int CurvePoints = 1024;
    const int Rays = 2048;
    const int MaxCrossings = 12;

    /// <summary>The exact cross-sections of one lens (slow: about a millisecond). Areas in units of θ_E².</summary>
    /// <param name="axisRatio">q in [0.05, 1].</param>
    /// <param name="shearGamma">External shear γ.</param>
    /// <param name="relativeShearAngleDeg">Shear position angle minus lens position angle [deg].</param>
    public static CrossSection Compute(double axisRatio, double shearGamma, double relativeShearAngleDeg)
    {
        var lens = new SieShearLens
        {
            ThetaEArcsec = 1.0, AxisRatio = axisRatio, PositionAngleDeg = 0.0,
            ShearGamma = shearGamma, ShearPositionAngleDeg = relativeShearAngleDeg,
        };
        var k = new SieKernel(lens);
        CriticalCurves.Trace(in k, CurvePoints, out _, out _, out var sx, out var sy, out var ux, out var uy, lensFrame: true);
        var causticHits = new double[Rays * MaxCrossings];
        var causticCount = new int[Rays];
        var cutHits = new double[Rays * MaxCrossings];
        var cutCount = new int[Rays];
        Crossings(sx, sy, causticHits, causticCount);
        Crossings(ux, uy, cutHits, cutCount);

        double two = 0, four = 0;
        Span<double> events = stackalloc double[2 * MaxCrossings];
        Span<int> owner = stackalloc int[2 * MaxCrossings];
        for (int r = 0; r < Rays; r++)
        {
            // Merge both curves' crossings along the ray, then sweep outward from R = 0.
            int nc = causticCount[r], nu = cutCount[r], n = 0;
            for (int i = 0; i < nc; i++) { events[n] = causticHits[r * MaxCrossings + i]; owner[n++] = 0; }
            for (int i = 0; i < nu; i++) { events[n] = cutHits[r * MaxCrossings + i]; owner[n++] = 1; }
            SortPairs(events[..n], owner[..n]);
            bool inCaustic = nc % 2 == 1, inCut = nu % 2 == 1;   // parity of all crossings tells whether R = 0 is inside
            double last = 0;
            for (int i = 0; i < n; i++)
            {
                double annulus = 0.5 * (events[i] * events[i] - last * last);
                if (inCaustic || inCut) two += annulus;
                if (inCaustic && inCut) four += annulus;
                if (owner[i] == 0) inCaustic = !inCaustic; else inCut = !inCut;
                last = events[i];
            }
        }
        double dpsi = 2 * Math.PI / Rays;
        double maxR = 0;
        for (int i = 0; i < CurvePoints; i++)
            maxR = Math.Max(maxR, Math.Max(Math.Sqrt(sx[i] * sx[i] + sy[i] * sy[i]), Math.Sqrt(ux[i] * ux[i] + uy[i] * uy[i])));
        return new CrossSection(two * dpsi, four * dpsi, maxR);
    }

    // Ray ψ_r = 2π (r + ½)/Rays; for every segment, the rays within its angular span get one crossing radius.
    static void Crossings(double[] x, double[] y, double[] hits, int[] counts)
    {
        int n = x.Length;
        const double rayStep = 2 * Math.PI / Rays;
        for (int i = 0; i < n; i++)
        {
            int j = (i + 1) % n;
            double ax = x[i], ay = y[i], bx = x[j], by = y[j];
            double pa = Math.Atan2(ay, ax);
            double d = Math.Atan2(by, bx) - pa;
            if (d > Math.PI) d -= 2 * Math.PI;
            if (d <= -Math.PI) d += 2 * Math.PI;
            if (d == 0) continue;
            double lo = Math.Min(pa, pa + d), hi = Math.Max(pa, pa + d);
            // Rays with lo ≤ ψ < hi (half-open, so a ray through a vertex is counted once).
            int first = (int)Math.Ceiling(lo / rayStep - 0.5), last = (int)Math.Ceiling(hi / rayStep - 0.5) - 1;
            double ex = bx - ax, ey = by - ay;
            for (int m = first; m <= last; m++)
            {
                double psi = (m + 0.5) * rayStep;
                (double s, double c) = Math.SinCos(psi);
                double den = c * ey - s * ex;
                if (den == 0) continue;
                double t = (ax * ey - ay * ex) / den;
                if (!(t > 0)) continue;
                int ray = ((m % Rays) + Rays) % Rays;
                if (counts[ray] < MaxCrossings) hits[ray * MaxCrossings + counts[ray]++] = t;
            }
        }
    }

    static void SortPairs(Span<double> keys, Span<int> values)
    {
        for (int i = 1; i < keys.Length; i++)
        {
            double k = keys[i];
            int v = values[i], j = i - 1;
            while (j >= 0 && keys[j] > k) { keys[j + 1] = keys[j]; values[j + 1] = values[j]; j--; }
            keys[j + 1] = k;
            values[j + 1] = v;
        }
    }
}
