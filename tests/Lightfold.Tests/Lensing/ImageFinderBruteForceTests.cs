using Lightfold.Lensing;
using Lightfold.Randomness;
using Xunit.Abstractions;

namespace Lightfold.Tests.Lensing;

public class ImageFinderBruteForceTests(ITestOutputHelper output)
{
    // Independent check: the brute-force triangle-mapping finder (GridImageFinder, a different algorithm
    // on the generic IMassModel evaluation) must find the same images as the fast polar finder for 10^4
    // random lenses and sources (the issue's count). Sources are drawn in a disk of 1.6 θ_E so that
    // 1-, 2-, 3- and 4-image configurations all occur. A 241² grid over ±3.2 θ_E resolves images
    // 0.027 θ_E apart; pairs closer than that (sources within ~1e-3 θ_E of a fold) are rare and the
    // brute force, not the fast finder, is then the one allowed to miss: on any disagreement the brute force
    // is rerun on a 401² grid, and only images within 0.1 θ_E of the singular centre may still differ.
    [Fact]
    public void Fast_finder_agrees_with_brute_force_on_10k_random_configurations()
    {
        const int configurations = 10_000;
        int mismatches = 0, bruteMissed = 0;
        var counts = new int[7];
        var failures = new List<string>();
        var lock_ = new object();
        Parallel.For(0, configurations, new ParallelOptions { MaxDegreeOfParallelism = 2 }, i =>
        {
            var rng = KeyedRandom.For(777, i, Lightfold.Randomness.Stage.Population);
            var lens = new SieShearLens
            {
                ThetaEArcsec = rng.Uniform(0.3, 2.0),
                AxisRatio = rng.Uniform(0.2, 1.0),
                PositionAngleDeg = rng.Uniform(0, 180),
                ShearGamma = rng.Uniform(0, 0.25),
                ShearPositionAngleDeg = rng.Uniform(0, 180),
            };
            // Half the sources near the centre (mostly four images), half anywhere within 1.5 θ_E.
            double rad = (i % 2 == 0 ? 0.3 : 1.5) * lens.ThetaEArcsec * Math.Sqrt(rng.NextDouble()), ang = rng.Uniform(0, 2 * Math.PI);
            double bx = rad * Math.Cos(ang), by = rad * Math.Sin(ang);
            Span<LensedImage> found = stackalloc LensedImage[ImageFinder.MaxImages];
            Assert.True(ImageFinder.TryFindImages(lens, bx, by, found, out int n, out _));
            double extent = 3.2 * lens.ThetaEArcsec / (1 - lens.ShearGamma);
            var brute = GridImageFinder.Find(lens.Prepare(), bx, by, extent, 161, 1e-11 * lens.ThetaEArcsec);
            // Where the two disagree, look again with a 2.5× finer grid before judging (close pairs near a fold).
            if (brute.Count != n) brute = GridImageFinder.Find(lens.Prepare(), bx, by, extent, 401, 1e-11 * lens.ThetaEArcsec);
            double tol = 1e-6 * lens.ThetaEArcsec;
            // Every brute-force image must be among the fast ones.
            bool ok = true;
            foreach (var (x, y, _) in brute)
            {
                bool match = false;
                for (int j = 0; j < n; j++)
                    if (Math.Abs(found[j].XArcsec - x) < tol && Math.Abs(found[j].YArcsec - y) < tol) match = true;
                if (!match) ok = false;
            }
            // Every fast image must satisfy the lens equation to 1e-10 θ_E (the issue's refinement bound).
            for (int j = 0; j < n; j++)
                if (!(found[j].ResidualArcsec < 1e-10 * lens.ThetaEArcsec)) ok = false;
            // Fast images are distinct.
            for (int j = 0; j < n; j++)
                for (int l = 0; l < j; l++)
                    if (Math.Abs(found[j].XArcsec - found[l].XArcsec) + Math.Abs(found[j].YArcsec - found[l].YArcsec) < 1e-8 * lens.ThetaEArcsec) ok = false;
            // A fast image the brute force lacks is allowed only within 0.1 θ_E (≈ 6 fine cells) of the singular
            // centre, where grid triangles span a wide range of directions and the triangle mapping fails
            // (the faint image of a source near the cut).
            int extra = 0;
            for (int j = 0; j < n; j++)
            {
                double fx = found[j].XArcsec, fy = found[j].YArcsec;
                bool inBrute = brute.Any(b => Math.Abs(b.X - fx) < tol && Math.Abs(b.Y - fy) < tol);
                if (inBrute) continue;
                extra++;
                if (Math.Sqrt(fx * fx + fy * fy) > 0.1 * lens.ThetaEArcsec) ok = false;
            }
            lock (lock_)
            {
                counts[Math.Min(n, 6)]++;
                if (extra > 0) bruteMissed++;
                if (!ok)
                {
                    mismatches++;
                    if (failures.Count < 10) failures.Add($"config {i}: fast {n}, brute {brute.Count}, lens {lens}, beta ({bx:R}, {by:R})");
                }
            }
        });
        output.WriteLine($"image counts 0..6: {string.Join(", ", counts)}; brute force missed images in {bruteMissed} configurations");
        foreach (var f in failures) output.WriteLine(f);
        Assert.True(mismatches == 0, string.Join("\n", failures));
        Assert.True(counts[4] > 1000 && counts[2] > 1000 && counts[1] > 100, "all multiplicities are exercised");
    }
}
