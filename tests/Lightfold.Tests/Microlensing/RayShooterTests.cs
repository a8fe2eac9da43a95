using Lightfold.Cosmology;
using Lightfold.Microlensing;
using Lightfold.Randomness;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Microlensing;

public class RayShooterTests
{
    // Theory: the mean magnification of a microlensing map equals the macro value 1/|(1 − κ)² − γ²| (flux
    // conservation; Kayser, Refsdal & Stabell 1986; Schneider, Ehlers & Falco 1992). A single map's mean scatters with
    // its size (≈1% per-map scatter for 60 R_E maps), so ten independent 60 R_E maps are averaged (standard error
    // ≈ 0.3–0.4%) and required within 1%: a saddle point, a minimum, and two more (κ, γ, κ_*).
    [Theory]
    [InlineData(0.55, 0.55, 0.3)]
    [InlineData(0.45, 0.45, 0.2)]
    [InlineData(0.3, 0.2, 0.1)]
    [InlineData(0.8, 0.5, 0.3)]
    public void Mean_magnification_equals_the_macro_value(double kappa, double gamma, double kappaStar)
    {
        double sum = 0;
        const int maps = 10;
        for (ulong seed = 1; seed <= maps; seed++)
        {
            var spec = new MapSpec { Kappa = kappa, Gamma = gamma, KappaStar = kappaStar, SizeEinsteinRadii = 60, Pixels = 150, RaysPerPixel = 20, Seed = seed, MarginEinsteinRadii = 5 };
            sum += RayShooter.Shoot(spec).Mean() / Math.Abs(spec.MacroMagnification) / maps;
        }
        AssertRelative.Equal(1.0, sum, 0.01, $"⟨μ⟩/μ_macro at κ = {kappa}, γ = {gamma}, κ_* = {kappaStar}");
    }

    // A single 1 M☉ star, no smooth matter, no shear: the map is the point-lens curve μ(u) = (u² + 2)/(u√(u² + 4))
    // (Paczyński 1986, ApJ 304, 1). Ring averages from u = 0.3 to 2.5 (outside the central pixels), within 2%
    // (ray noise: ≈ 400 rays per pixel × ≥ 50 pixels per ring).
    [Fact]
    public void Single_star_reproduces_the_point_lens_curve()
    {
        var spec = new MapSpec { Kappa = 0, Gamma = 0, KappaStar = 0, SizeEinsteinRadii = 6, Pixels = 240, RaysPerPixel = 400, MarginEinsteinRadii = 2 };
        var map = RayShooter.Shoot(spec, stars: new StarField([0.0], [0.0], [1.0]));
        int n = map.Pixels;
        double pixel = map.PixelEinsteinRadii;
        for (double u = 0.3; u <= 2.5; u += 0.2)
        {
            double sum = 0, expected = 0;
            int count = 0;
            for (int y = 0; y < n; y++)
                for (int x = 0; x < n; x++)
                {
                    double px = (x + 0.5) * pixel - 3, py = (y + 0.5) * pixel - 3, r = Math.Sqrt(px * px + py * py);
                    if (Math.Abs(r - u) > 0.05) continue;
                    sum += map.Magnification[y * n + x];
                    expected += (r * r + 2) / (r * Math.Sqrt(r * r + 4));
                    count++;
                }
            AssertRelative.Equal(expected / count, sum / count, 0.02, $"u = {u:F1} ({count} pixels)");
        }
    }

    // κ_* → 0: no stars, so the map is uniform at the macro magnification. A regular ray grid aliased against the pixel
    // edges gives single pixels ±1 ray per row or column of rays (~10%), so 10 × 10-pixel blocks are compared (2%);
    // the mean within 0.5%.
    [Fact]
    public void No_stars_gives_a_uniform_map_at_the_macro_value()
    {
        var spec = new MapSpec { Kappa = 0.4, Gamma = 0.3, KappaStar = 0, SizeEinsteinRadii = 10, Pixels = 100, RaysPerPixel = 100 };
        var map = RayShooter.Shoot(spec);
        double macro = Math.Abs(spec.MacroMagnification);
        Assert.Equal(0, map.Stars);
        for (int by = 0; by < 10; by++)
            for (int bx = 0; bx < 10; bx++)
            {
                double block = 0;
                for (int y = 10 * by; y < 10 * by + 10; y++)
                    for (int x = 10 * bx; x < 10 * bx + 10; x++) block += map.Magnification[y * 100 + x] / 100;
                AssertRelative.Equal(macro, block, 0.02, $"block ({bx}, {by})");
            }
        AssertRelative.Equal(macro, map.Mean(), 0.005);
    }

    // A source much larger than the Einstein radius averages the caustic network away: a uniform disk 25 R_E in radius
    // on a 60 R_E map has the macro magnification within 2%.
    [Fact]
    public void Large_source_converges_to_the_macro_value()
    {
        var spec = new MapSpec { Kappa = 0.45, Gamma = 0.35, KappaStar = 0.3, SizeEinsteinRadii = 60, Pixels = 300, RaysPerPixel = 20, MarginEinsteinRadii = 5 };
        var map = RayShooter.Shoot(spec);
        double rPixels = 25 / map.PixelEinsteinRadii;
        var source = new FiniteSource(map, 150, 150, rPixels + 1, limbDarkening: 0);
        double disk = source.Factor(rPixels) * map.Mean();
        AssertRelative.Equal(Math.Abs(spec.MacroMagnification), disk, 0.02);
        // And a point source sees the pixel value: the factor varies across the map.
        var a = new FiniteSource(map, 40.5, 60.5, 5, 0).Factor(0.5);
        var b = new FiniteSource(map, 200.5, 230.5, 5, 0).Factor(0.5);
        Assert.NotEqual(a, b);
    }

    // The fast algorithm's deflections against direct summation over all stars at 4000 random rays: relative error
    // below the documented bound of 1e-3 (measured ~1e-4 with θ = 0.5, P = K = 12).
    [Fact]
    public void Tree_deflections_match_direct_summation()
    {
        var spec = new MapSpec { Kappa = 0.5, Gamma = 0.4, KappaStar = 0.4, SizeEinsteinRadii = 20, Pixels = 100, RaysPerPixel = 10, Seed = 5 };
        var stars = RayShooter.Stars(spec);
        var tree = new StarTree(stars);
        var rng = KeyedRandom.For(1, 0, Stage.StarField);
        var re = new double[StarTree.Order + 1];
        var im = new double[StarTree.Order + 1];
        var near = new List<int>();
        double worst = 0;
        for (int t = 0; t < 200; t++)
        {
            double cx = rng.Uniform(-30, 30), cy = rng.Uniform(-30, 30), h = rng.Uniform(0.2, 2);
            tree.Expand(cx, cy, h, re, im, near);
            for (int r = 0; r < 20; r++)
            {
                double x = cx + rng.Uniform(-h, h), y = cy + rng.Uniform(-h, h), ux = x - cx, uy = y - cy;
                double fr = re[StarTree.Order], fi = im[StarTree.Order];
                for (int k = StarTree.Order - 1; k >= 0; k--) { double tr = fr * ux - fi * uy + re[k]; fi = fr * uy + fi * ux + im[k]; fr = tr; }
                double ax = fr, ay = -fi;
                foreach (int s in near) { double dx = x - stars.X[s], dy = y - stars.Y[s], f = stars.Mass[s] / (dx * dx + dy * dy); ax += f * dx; ay += f * dy; }
                var (ex, ey) = stars.DirectDeflection(x, y);
                worst = Math.Max(worst, Math.Sqrt((ax - ex) * (ax - ex) + (ay - ey) * (ay - ey)) / Math.Sqrt(ex * ex + ey * ey));
            }
        }
        Assert.True(stars.Count > 10_000, $"{stars.Count} stars");
        Assert.True(worst < 1e-3, $"worst relative deflection error {worst:E2}");
    }

    // Determinism: the same key gives a bit-identical map with one and two threads.
    [Fact]
    public void Same_key_gives_a_bit_identical_map_on_one_or_two_threads()
    {
        var spec = new MapSpec { Kappa = 0.6, Gamma = 0.3, KappaStar = 0.3, SizeEinsteinRadii = 8, Pixels = 120, RaysPerPixel = 30, Seed = 9 };
        var one = RayShooter.Shoot(spec, threads: 1);
        var two = RayShooter.Shoot(spec, threads: 2);
        Assert.Equal(one.Magnification, two.Magnification);
        Assert.NotEqual(one.Magnification, RayShooter.Shoot(spec with { Seed = 10 }, threads: 2).Magnification);
    }

    // Einstein radius of a 1 M☉ star on the source plane, flat ΛCDM H0 = 70: 4.11e16 cm (z_l = 0.5, z_s = 1), 5.88e16
    // (0.3, 1.0), 5.24e16 (0.5, 2.0) (REFERENCES.md §7 [D]), to the three digits given.
    [Theory]
    [InlineData(0.5, 1.0, 4.11e16)]
    [InlineData(0.3, 1.0, 5.88e16)]
    [InlineData(0.5, 2.0, 5.24e16)]
    public void Einstein_radius_on_the_source_plane(double zl, double zs, double expectedCm)
    {
        var c = new FlrwCosmology(new CosmologyParameters());
        double re = MicrolensingSettings.EinsteinRadiusCm(c.AngularDiameterDistanceMpc(zl), c.AngularDiameterDistanceMpc(zs), c.AngularDiameterDistanceMpc(zl, zs));
        AssertRelative.Equal(expectedCm, re, 0.0013);
    }

    // Salpeter (1955) IMF dN/dm ∝ m^−2.35 on [0.1, 1] M☉: mean mass ∫m^−1.35/∫m^−2.35 (closed form) and a KS test of
    // 10^5 draws against the analytic CDF.
    [Fact]
    public void Salpeter_masses_follow_the_power_law()
    {
        var imf = new InitialMassFunction();
        double expectedMean = (Math.Pow(1, -0.35) - Math.Pow(0.1, -0.35)) / -0.35 / ((Math.Pow(1, -1.35) - Math.Pow(0.1, -1.35)) / -1.35);
        AssertRelative.Equal(expectedMean, imf.MeanMassSolar, 1e-12);
        var rng = KeyedRandom.For(3, 0, Stage.StarField);
        var m = new double[100_000];
        for (int i = 0; i < m.Length; i++) m[i] = imf.Sample(ref rng);
        Assert.True(Statistics.KolmogorovSmirnov(m, v => (Math.Pow(v, -1.35) - Math.Pow(0.1, -1.35)) / (1 - Math.Pow(0.1, -1.35))) < Statistics.KsCritical1Percent(m.Length));
        var kroupa = new InitialMassFunction { Kind = "kroupa", MinMassSolar = 0.08, MaxMassSolar = 1.0 };
        Assert.InRange(kroupa.MeanMassSolar, 0.2, 0.5);
    }
}
