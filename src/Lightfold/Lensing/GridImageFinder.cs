namespace Lightfold.Lensing;

/// <summary>A slow, general image finder for any <see cref="IMassModel"/>: the reference the fast finder is tested and benchmarked against.</summary>
/// <remarks>
/// Brute force: an image-plane grid is mapped to the source plane, every grid triangle whose image contains
/// β yields a candidate (Schneider, Ehlers &amp; Falco 1992, §11.2, from memory; the standard triangle-mapping
/// method), and each candidate is polished by Newton iteration on the lens equation. Images closer together
/// than a grid cell, or within a cell of a singularity, can be missed; use a fine grid.
/// </remarks>
public static class GridImageFinder
{
    /// <summary>All images of β found on an n × n grid over [−extent, extent]² (n odd keeps the origin off the vertices).</summary>
    public static List<(double X, double Y, LensPoint Point)> Find(IMassModel lens, double betaX, double betaY,
        double extentArcsec, int n, double residualTolArcsec)
    {
        if (n % 2 == 0) n++;
        double step = 2.0 * extentArcsec / n;
        int m = n + 1;
        var sx = new double[m * m];
        var sy = new double[m * m];
        for (int j = 0; j < m; j++)
        for (int i = 0; i < m; i++)
        {
            double x = -extentArcsec + i * step, y = -extentArcsec + j * step;
            var p = lens.Evaluate(x, y);
            sx[j * m + i] = x - p.AlphaX;
            sy[j * m + i] = y - p.AlphaY;
        }

        var result = new List<(double, double, LensPoint)>();
        for (int j = 0; j < n; j++)
        for (int i = 0; i < n; i++)
        {
            int v00 = j * m + i, v10 = v00 + 1, v01 = v00 + m, v11 = v01 + 1;
            TryTriangle(v00, v10, v11, i, j, 0);
            TryTriangle(v00, v11, v01, i, j, 1);
        }
        return result;

        void TryTriangle(int a, int b, int c, int i, int j, int half)
        {
            double x1 = sx[a] - betaX, y1 = sy[a] - betaY, x2 = sx[b] - betaX, y2 = sy[b] - betaY, x3 = sx[c] - betaX, y3 = sy[c] - betaY;
            double d1 = x1 * y2 - x2 * y1, d2 = x2 * y3 - x3 * y2, d3 = x3 * y1 - x1 * y3;
            bool inside = (d1 >= 0 && d2 >= 0 && d3 >= 0) || (d1 <= 0 && d2 <= 0 && d3 <= 0);
            if (!inside) return;
            double x0 = -extentArcsec + (i + (half == 0 ? 0.667 : 0.333)) * step;
            double y0 = -extentArcsec + (j + (half == 0 ? 0.333 : 0.667)) * step;
            if (!Polish(lens, betaX, betaY, ref x0, ref y0, residualTolArcsec, out var point)) return;
            foreach (var (ex, ey, _) in result)
                if (Math.Abs(ex - x0) < 1e-7 * (1 + extentArcsec) && Math.Abs(ey - y0) < 1e-7 * (1 + extentArcsec)) return;
            result.Add((x0, y0, point));
        }
    }

    /// <summary>Newton iteration on β = θ − α(θ) from (x, y); true if it converges below the tolerance.</summary>
    public static bool Polish(IMassModel lens, double betaX, double betaY, ref double x, ref double y, double tol, out LensPoint point)
    {
        point = lens.Evaluate(x, y);
        for (int it = 0; it < 60; it++)
        {
            double ex = betaX - x + point.AlphaX, ey = betaY - y + point.AlphaY;
            if (Math.Sqrt(ex * ex + ey * ey) < tol) return true;
            double a11 = 1 - point.Hxx, a22 = 1 - point.Hyy, a12 = -point.Hxy, det = a11 * a22 - a12 * a12;
            if (!(Math.Abs(det) > 0) || !double.IsFinite(det)) return false;
            double dx = (a22 * ex - a12 * ey) / det, dy = (-a12 * ex + a11 * ey) / det;
            double len = Math.Sqrt(dx * dx + dy * dy), r = Math.Sqrt(x * x + y * y);
            if (len > 0.5 * r && r > 0) { dx *= 0.5 * r / len; dy *= 0.5 * r / len; }   // damp steps that would jump through the centre
            x += dx;
            y += dy;
            point = lens.Evaluate(x, y);
            if (!double.IsFinite(point.AlphaX)) return false;
        }
        return false;
    }
}
