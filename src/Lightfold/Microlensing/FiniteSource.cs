namespace Lightfold.Microlensing;

/// <summary>A source's view of one map position: ring-averaged magnification, so a limb-darkened disk of any radius is cheap.</summary>
/// <remarks>
/// Pixels within R_max of the position are binned by distance (bins of 0.25 pixel); a disk of radius R with linear limb
/// darkening I(ρ) = 1 − u(1 − √(1 − ρ²)) (ρ = r/R; u = 0.6 by default, a typical optical value, common practice) then
/// averages the rings with weights I × area. Below one pixel the nearest pixel is used (a point source); above R_max the
/// disk is wider than the map region kept and the factor is 1. The factor is normalised by the map's own mean, so it
/// averages to 1 over the map: a bank map of a few R_E has a mean that scatters by several per cent (tens near the
/// critical line) about the macro value, and the macro magnification is already in the image's |μ|.
/// </remarks>
public sealed class FiniteSource
{
    const double BinPixels = 0.25;
    readonly double[] ringSum;
    readonly int[] ringCount;
    readonly double centreValue, norm;
    readonly double limbDarkening;

    /// <summary>Prepares the ring profile around pixel coordinates (cx, cy) out to rMax pixels.</summary>
    public FiniteSource(MagnificationMap map, double cx, double cy, double rMaxPixels, double limbDarkening)
    {
        int n = map.Pixels;
        this.limbDarkening = limbDarkening;
        norm = map.Mean();
        int bins = (int)Math.Ceiling(rMaxPixels / BinPixels) + 1;
        ringSum = new double[bins];
        ringCount = new int[bins];
        int x0 = Math.Max(0, (int)(cx - rMaxPixels - 1)), x1 = Math.Min(n - 1, (int)(cx + rMaxPixels + 1));
        int y0 = Math.Max(0, (int)(cy - rMaxPixels - 1)), y1 = Math.Min(n - 1, (int)(cy + rMaxPixels + 1));
        for (int y = y0; y <= y1; y++)
            for (int x = x0; x <= x1; x++)
            {
                double dx = x + 0.5 - cx, dy = y + 0.5 - cy, r = Math.Sqrt(dx * dx + dy * dy);
                int b = (int)(r / BinPixels);
                if (b >= bins) continue;
                ringSum[b] += map.Magnification[y * n + x];
                ringCount[b]++;
            }
        centreValue = map.Magnification[Math.Clamp((int)cy, 0, n - 1) * n + Math.Clamp((int)cx, 0, n - 1)];
        RMaxPixels = rMaxPixels;
    }

    /// <summary>Largest radius the profile covers [pixels].</summary>
    public double RMaxPixels { get; }

    /// <summary>Micro magnification μ_disk/⟨μ⟩_map of a limb-darkened disk of radius R [pixels].</summary>
    public double Factor(double radiusPixels)
    {
        if (!(radiusPixels >= 1)) return centreValue / norm;
        if (radiusPixels > RMaxPixels) return 1.0;
        double num = 0, den = 0;
        int last = Math.Min(ringSum.Length - 1, (int)(radiusPixels / BinPixels));
        for (int b = 0; b <= last; b++)
        {
            if (ringCount[b] == 0) continue;
            double rho = Math.Min(1, (b + 0.5) * BinPixels / radiusPixels);
            double intensity = 1 - limbDarkening * (1 - Math.Sqrt(1 - rho * rho));
            num += intensity * ringSum[b];
            den += intensity * ringCount[b];
        }
        return den > 0 ? num / den / norm : 1.0;
    }
}
