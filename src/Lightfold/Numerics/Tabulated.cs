namespace Lightfold.Numerics;

/// <summary>Helpers for functions tabulated on grids: linear interpolation on a uniform grid, inverse CDFs, discrete picks.</summary>
public static class Tabulated
{
    /// <summary>y(v) by linear interpolation on the uniform grid x (clamped to the end values outside it).</summary>
    public static double Interpolate(double[] x, double[] y, double v)
    {
        if (v <= x[0]) return y[0];
        if (v >= x[^1]) return y[^1];
        double step = x[1] - x[0];
        int i = Math.Min((int)((v - x[0]) / step), x.Length - 2);
        double f = (v - x[i]) / step;
        return y[i] + f * (y[i + 1] - y[i]);
    }

    /// <summary>Inverse of a tabulated, non-decreasing CDF (any normalisation) at u ∈ [0, 1), linear between nodes
    /// (a piecewise-constant density).</summary>
    public static double InverseCdf(double[] x, double[] cdf, double u)
    {
        double target = u * cdf[^1];
        int lo = 0, hi = cdf.Length - 1;
        while (hi - lo > 1)
        {
            int mid = (lo + hi) >> 1;
            if (cdf[mid] <= target) lo = mid; else hi = mid;
        }
        double span = cdf[hi] - cdf[lo];
        double f = span > 0 ? (target - cdf[lo]) / span : 0.5;
        return x[lo] + f * (x[hi] - x[lo]);
    }

    /// <summary>The first item whose cumulative probability exceeds u (the last item if none does).</summary>
    public static T Pick<T>(T[] items, double[] cumulative, double u)
    {
        for (int i = 0; i < items.Length; i++) if (u < cumulative[i]) return items[i];
        return items[^1];
    }
}
