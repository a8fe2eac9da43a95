using System.Globalization;
using System.Text.Json;
using Lightfold.Cosmology;
using Lightfold.Lensing;
using Lightfold.Numerics;
using Lightfold.Randomness;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Cli;

/// <summary>
/// Independent check of `lightfold lens`: every number it prints is recomputed here from the catalog
/// contract in DESIGN.md alone (rotation, the contract's κ, external shear, Fermat potential, D_Δt), with the
/// deflection obtained by numerically integrating κ (Keeton 2001 J-integrals) rather than the closed form,
/// and image completeness judged by the brute-force triangle finder.
/// </summary>
public class LensCommandContractTests
{
    [Fact]
    public void Lens_command_output_satisfies_the_contract_for_random_configurations()
    {
        var cosmology = new FlrwCosmology(new CosmologyParameters());
        for (int i = 0; i < 120; i++)
        {
            var rng = KeyedRandom.For(53, i, Stage.Population);
            double zl = rng.Uniform(0.1, 1.0), zs = zl + rng.Uniform(0.3, 2.5), sigma = rng.Uniform(150, 320);
            var c0 = new ContractLens(0, rng.Uniform(0.3, 1.0), rng.Uniform(-90, 180), rng.Uniform(0, 0.2), rng.Uniform(0, 180));
            double thetaE = 4 * Math.PI * Math.Pow(sigma / 299792.458, 2)
                            * cosmology.AngularDiameterDistanceMpc(zl, zs) / cosmology.AngularDiameterDistanceMpc(zs) * 648000 / Math.PI;
            var contract = c0 with { ThetaE = thetaE };
            double r = 0.9 * thetaE * Math.Sqrt(rng.NextDouble()), a = rng.Uniform(0, 2 * Math.PI);
            double bx = r * Math.Cos(a), by = r * Math.Sin(a);
            string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
            var (code, output, err) = CliRunner.Run("lens", "--sigma-v", F(sigma), "--z-lens", F(zl), "--z-source", F(zs),
                "--q", F(contract.Q), "--pa", F(contract.PaDeg), "--shear", F(contract.Gamma), "--shear-pa", F(contract.ShearPaDeg),
                "--source-x", F(bx), "--source-y", F(by), "--format", "json");
            Assert.True(code == 0, err);
            using var doc = JsonDocument.Parse(output);
            var root = doc.RootElement;
            AssertRelative.Equal(thetaE, root.GetProperty("theta_e_arcsec").GetDouble(), 1e-10, "θ_E");
            double dDt = (1 + zl) * cosmology.AngularDiameterDistanceMpc(zl) * cosmology.AngularDiameterDistanceMpc(zs) / cosmology.AngularDiameterDistanceMpc(zl, zs);
            AssertRelative.Equal(dDt, root.GetProperty("time_delay_distance_mpc").GetDouble(), 1e-10, "D_Δt");
            double daysPerArcsec2 = dDt * 3.0856775814913673e19 / 299792.458 / 86400 / Math.Pow(648000 / Math.PI, 2);

            var images = root.GetProperty("images").EnumerateArray().ToList();
            Assert.Equal(images.Count, root.GetProperty("n_images").GetInt32());
            double tau0 = double.NaN, lastDelay = -1;
            for (int k = 0; k < images.Count; k++)
            {
                var im = images[k];
                Assert.Equal(k, im.GetProperty("image_index").GetInt32());
                double x = im.GetProperty("x_arcsec").GetDouble(), y = im.GetProperty("y_arcsec").GetDouble();
                var (ax, ay) = contract.Alpha(x, y);
                Assert.True(Math.Sqrt(Math.Pow(bx - (x - ax), 2) + Math.Pow(by - (y - ay), 2)) < 1e-9 * thetaE, $"lens equation at image {k}");
                // Jacobian by central differences of the independent deflection (step 1e-5 θ_E: error ~1e-9 relative).
                double h = 1e-5 * thetaE;
                var (pxx, pxy) = contract.Alpha(x + h, y); var (mxx, mxy) = contract.Alpha(x - h, y);
                var (pyx, pyy) = contract.Alpha(x, y + h); var (myx, myy) = contract.Alpha(x, y - h);
                double hxx = (pxx - mxx) / (2 * h), hyx = (pxy - mxy) / (2 * h), hxy = (pyx - myx) / (2 * h), hyy = (pyy - myy) / (2 * h);
                double det = (1 - hxx) * (1 - hyy) - hxy * hyx;
                AssertRelative.Equal(1 / det, im.GetProperty("magnification").GetDouble(), 1e-5, $"μ of image {k}");
                AssertRelative.Equal(contract.Kappa(x, y), im.GetProperty("kappa").GetDouble(), 1e-9, $"κ of image {k}");
                double g1 = 0.5 * (hxx - hyy), g2 = 0.5 * (hxy + hyx);
                AssertRelative.Equal(Math.Sqrt(g1 * g1 + g2 * g2), im.GetProperty("gamma").GetDouble(), 1e-5, $"γ of image {k}");
                double tau = 0.5 * (Math.Pow(x - bx, 2) + Math.Pow(y - by, 2)) - contract.Potential(x, y);
                if (k == 0) tau0 = tau;
                double delay = im.GetProperty("delay_days").GetDouble();
                AssertRelative.Near((tau - tau0) * daysPerArcsec2, delay, 1e-6 + 1e-8 * delay, $"delay of image {k}");
                Assert.True(delay >= lastDelay, "images ordered by arrival");
                lastDelay = delay;
            }
            // Completeness: the brute-force finder finds nothing the command missed.
            var lens = new SieShearLens { ThetaEArcsec = thetaE, AxisRatio = contract.Q, PositionAngleDeg = contract.PaDeg, ShearGamma = contract.Gamma, ShearPositionAngleDeg = contract.ShearPaDeg };
            foreach (var (x, y, _) in GridImageFinder.Find(lens.Prepare(), bx, by, 3.5 * thetaE, 241, 1e-11 * thetaE))
                Assert.Contains(images, im => Math.Abs(im.GetProperty("x_arcsec").GetDouble() - x) < 1e-7 && Math.Abs(im.GetProperty("y_arcsec").GetDouble() - y) < 1e-7);
        }
    }

    [Theory]
    [InlineData("--q", "3")]
    [InlineData("--shear", "-0.1")]
    [InlineData("--z-source", "0.1")]
    [InlineData("--sigma-v", "NaN")]
    public void Bad_lens_arguments_exit_2_naming_the_option(string option, string value)
    {
        var args = new List<string> { "lens", "--sigma-v", "250", "--z-lens", "0.5", "--z-source", "2", "--source-x", "0.1", "--source-y", "0" };
        int at = args.IndexOf(option);
        if (at >= 0) args[at + 1] = value; else args.AddRange([option, value]);
        var (code, _, err) = CliRunner.Run([.. args]);
        Assert.Equal(2, code);
        Assert.Contains(option, err);
    }

    [Fact]
    public void Caustics_file_has_three_closed_curves()
    {
        string path = Path.Combine(Path.GetTempPath(), $"caustics-{Guid.NewGuid():N}.csv");
        var (code, _, err) = CliRunner.Run("lens", "--sigma-v", "250", "--z-lens", "0.5", "--z-source", "2", "--q", "0.6", "--source-x", "0.1", "--source-y", "0", "--caustics", path);
        Assert.True(code == 0, err);
        var lines = File.ReadAllLines(path);
        Assert.Equal("curve,x_arcsec,y_arcsec", lines[0]);
        Assert.Equal(["cut", "tangential_caustic", "tangential_critical"], lines.Skip(1).Select(l => l.Split(',')[0]).Distinct().Order().ToArray());
        Assert.Empty(Directory.GetFiles(Path.GetTempPath(), Path.GetFileName(path) + ".partial-*"));
    }
}
