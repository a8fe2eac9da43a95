using System.Runtime.Intrinsics;
using Lightfold.Randomness;

namespace Lightfold.Microlensing;

/// <summary>Magnification maps by inverse ray shooting (Kayser, Refsdal &amp; Stabell 1986, A&amp;A 166, 36; Wambsganss 1990,
/// PhD thesis, Munich) with a tree and local-expansion far field (<see cref="StarTree"/>).</summary>
/// <remarks>
/// Lens equation in the shear frame: y₁ = (1 − κ_c − γ) x₁ − α₁, y₂ = (1 − κ_c + γ) x₂ − α₂, with κ_c = κ − κ_* in smooth
/// matter and α from the stars. Rays lie on a regular image-plane grid covering the pre-image of the map plus a margin;
/// their spacing gives the requested mean rays per pixel at the macro magnification. Stars fill a disk 1.2× the
/// shooting region's half-diagonal plus 10 R_E, so the stars' mean deflection inside the region is that of a uniform sheet.
/// Rays are grouped in patches of 64 × 64; each patch gets one local expansion of the far stars and a list of near
/// stars summed directly; rays are processed four at a time with 256-bit vectors. Patches are spread over threads; each thread counts into its own integer map and the counts
/// are added at the end, so the map is bit-identical whatever the thread count.
/// </remarks>
public static class RayShooter
{
    const int PatchRays = 64;

    /// <summary>The star field a spec implies (deterministic in its seed).</summary>
    public static StarField Stars(MapSpec spec)
    {
        var (hx, hy) = ShootingHalfWidths(spec);
        double radius = 1.2 * Math.Sqrt(hx * hx + hy * hy) + 10;
        var rng = KeyedRandom.For(spec.Seed, 0, Stage.StarField);
        return StarField.Uniform(spec.KappaStar, radius, spec.Imf, ref rng);
    }

    /// <summary>Half-widths of the image-plane region whose rays can reach the map (with the margin).</summary>
    public static (double X, double Y) ShootingHalfWidths(MapSpec spec)
    {
        double kc = spec.Kappa - spec.KappaStar;
        // The stars act on average like a sheet κ_*, so the mean mapping has eigenvalues 1 − κ ∓ γ.
        double a1 = Math.Abs(1 - spec.Kappa - spec.Gamma), a2 = Math.Abs(1 - spec.Kappa + spec.Gamma);
        double half = spec.SizeEinsteinRadii / 2 + spec.MarginEinsteinRadii;
        _ = kc;
        return (half / Math.Max(a1, 1e-3), half / Math.Max(a2, 1e-3));
    }

    /// <summary>Shoots the map with the fast far-field method.</summary>
    public static MagnificationMap Shoot(MapSpec spec, int threads = 0, StarField? stars = null)
    {
        stars ??= Stars(spec);
        var tree = new StarTree(stars);
        var (hx, hy) = ShootingHalfWidths(spec);
        int n = spec.Pixels;
        double pixel = spec.SizeEinsteinRadii / n;
        double mu = Math.Abs(spec.MacroMagnification);
        // Image-plane spacing d: each pixel gets RaysPerPixel rays on average: RaysPerPixel = |μ| pixel² / d².
        double d = pixel * Math.Sqrt(mu / spec.RaysPerPixel);
        int nx = Math.Max(1, (int)Math.Ceiling(2 * hx / d)), ny = Math.Max(1, (int)Math.Ceiling(2 * hy / d));
        long rays = (long)nx * ny;
        if (rays > 20_000_000_000L) throw new InputException($"map needs {rays:N0} rays; lower --rays-per-pixel or --pixels");
        int px = (nx + PatchRays - 1) / PatchRays, py = (ny + PatchRays - 1) / PatchRays;
        double kc = spec.Kappa - spec.KappaStar, g = spec.Gamma;
        double half = spec.SizeEinsteinRadii / 2, inv = 1 / pixel;
        var total = new long[n * n];
        var options = new ParallelOptions { MaxDegreeOfParallelism = threads > 0 ? threads : Environment.ProcessorCount };
        object gate = new();
        long near = 0;
        Parallel.For(0, px * py, options, () => new Worker(n), (patch, _, w) =>
        {
            int ix0 = patch % px * PatchRays, iy0 = patch / px * PatchRays;
            int ix1 = Math.Min(ix0 + PatchRays, nx), iy1 = Math.Min(iy0 + PatchRays, ny);
            double x0 = -hx + (ix0 + 0.5) * d, y0 = -hy + (iy0 + 0.5) * d;
            double cx = x0 + 0.5 * (ix1 - ix0 - 1) * d, cy = y0 + 0.5 * (iy1 - iy0 - 1) * d;
            double hpatch = 0.5 * PatchRays * d;
            tree.Expand(cx, cy, hpatch, w.LocalRe, w.LocalIm, w.Near);
            int nearCount = w.Near.Count;
            w.NearInteractions += (long)nearCount * (ix1 - ix0) * (iy1 - iy0);
            if (w.NearX.Length < nearCount) { w.NearX = new double[nearCount * 2]; w.NearY = new double[nearCount * 2]; w.NearM = new double[nearCount * 2]; }
            for (int k = 0; k < nearCount; k++) { int s = w.Near[k]; w.NearX[k] = stars.X[s]; w.NearY[k] = stars.Y[s]; w.NearM[k] = stars.Mass[s]; }
            // Four rays at a time along x (Vector256<double>); the far field by Horner's rule in u = x − c.
            var lr = w.LocalRe; var li = w.LocalIm;
            var lane = Vector256.Create(0.0, 1.0, 2.0, 3.0) * d;
            for (int iy = iy0; iy < iy1; iy++)
            {
                double y = -hy + (iy + 0.5) * d;
                var vy = Vector256.Create(y);
                var vuy = Vector256.Create(y - cy);
                for (int ix = ix0; ix < ix1; ix += 4)
                {
                    var vx = Vector256.Create(-hx + (ix + 0.5) * d) + lane;
                    var vux = vx - Vector256.Create(cx);
                    var fr = Vector256.Create(lr[StarTree.Order]);
                    var fi = Vector256.Create(li[StarTree.Order]);
                    for (int k = StarTree.Order - 1; k >= 0; k--)
                    {
                        var tr = fr * vux - fi * vuy + Vector256.Create(lr[k]);
                        fi = fr * vuy + fi * vux + Vector256.Create(li[k]);
                        fr = tr;
                    }
                    var ax = fr;
                    var ay = -fi;   // α = conj(f)
                    for (int k = 0; k < nearCount; k++)
                    {
                        var dx = vx - Vector256.Create(w.NearX[k]);
                        var dy = vy - Vector256.Create(w.NearY[k]);
                        var f = Vector256.Create(w.NearM[k]) / (dx * dx + dy * dy);
                        ax += f * dx;
                        ay += f * dy;
                    }
                    var sx = Vector256.Create(1 - kc - g) * vx - ax;
                    var sy = Vector256.Create(1 - kc + g) * vy - ay;
                    int lanes = Math.Min(4, ix1 - ix);
                    for (int l = 0; l < lanes; l++)
                    {
                        double u = (sx.GetElement(l) + half) * inv, v = (sy.GetElement(l) + half) * inv;
                        if (u >= 0 && u < n && v >= 0 && v < n) w.Counts[(int)v * n + (int)u]++;
                    }
                }
            }
            return w;
        }, w =>
        {
            lock (gate)
            {
                for (int i = 0; i < total.Length; i++) total[i] += w.Counts[i];
                near += w.NearInteractions;
            }
        });
        double perRay = d * d / (pixel * pixel);   // μ of a pixel = (rays × image area per ray) / pixel area
        var map = new float[n * n];
        for (int i = 0; i < map.Length; i++) map[i] = (float)(total[i] * perRay);
        return new MagnificationMap(spec, map, stars.Count, rays) { NearInteractions = near };
    }

    sealed class Worker(int n)
    {
        public readonly int[] Counts = new int[n * n];
        public readonly double[] LocalRe = new double[StarTree.Order + 1];
        public readonly double[] LocalIm = new double[StarTree.Order + 1];
        public readonly List<int> Near = [];
        public double[] NearX = new double[64], NearY = new double[64], NearM = new double[64];
        public long NearInteractions;
    }
}
