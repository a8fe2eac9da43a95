using Lightfold.Cosmology;
using Lightfold.Randomness;

namespace Lightfold.Tests.Cosmology;

public class DistanceTableTests
{
    // Internal check (fast path = exact path): the table must agree with direct quadrature to
    // 1e-7 relative over 0 < z ≤ 10 (the bound). 4000 random redshifts per cosmology probe
    // every one of the 1280 grid intervals about three times, including points near nodes and mid-interval.
    [Theory]
    [InlineData(0.3, 0.0, -1.0, 0.0, 0.0)]
    [InlineData(0.3, 0.1, -1.0, 0.0, 0.0)]
    [InlineData(0.3, -0.1, -1.0, 0.0, 0.0)]
    [InlineData(0.3, 0.0, -0.8, -0.5, 2.7255)]
    [InlineData(1.0, 0.0, -1.0, 0.0, 0.0)]
    public void Table_matches_quadrature_to_1e_7(double omegaM, double omegaK, double w0, double wa, double tcmb)
    {
        var c = new FlrwCosmology(new CosmologyParameters { OmegaM0 = omegaM, OmegaK0 = omegaK, W0 = w0, WA = wa, TcmbK = tcmb });
        var rng = KeyedRandom.For(1, 0, Stage.Population);
        double worst = 0;
        for (int i = 0; i < 4000; i++)
        {
            double z = i < 10 ? Math.Pow(10, -6 + i * 0.5) : 10.0 * rng.NextDouble();
            if (z == 0) continue;
            double exact = c.ComovingDistanceMpc(z);
            double fast = c.Table.ComovingDistanceMpc(z);
            worst = Math.Max(worst, Math.Abs(fast - exact) / exact);
            if (i % 40 == 0)
            {
                double zl = z * rng.NextDouble();
                double e2 = c.AngularDiameterDistanceMpc(zl, z), f2 = c.Table.AngularDiameterDistanceMpc(zl, z);
                if (e2 > 1e-3 * c.HubbleDistanceMpc) worst = Math.Max(worst, Math.Abs(f2 - e2) / e2);
            }
        }
        Assert.True(worst < 1e-7, $"worst relative error {worst:E2}");
    }

    [Fact]
    public void Table_beyond_its_range_falls_back_to_quadrature()
    {
        var c = new FlrwCosmology(new CosmologyParameters());
        Assert.Equal(c.ComovingDistanceMpc(20.0), c.Table.ComovingDistanceMpc(20.0), 9);
        Assert.Throws<ArgumentOutOfRangeException>(() => c.Table.ComovingDistanceMpc(-0.1));
    }
}
