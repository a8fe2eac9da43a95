using Lightfold.Cosmology;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Cosmology;

public class FlrwCosmologyTests
{
    public static TheoryData<string, double, string> AstropyCases()
    {
        var data = new TheoryData<string, double, string>();
        foreach (var row in AstropyRow.Load())
            foreach (string quantity in row.Values.Keys)
                data.Add(row.Case, row.Z, quantity);
        return data;
    }

    // External values: astropy 5.2.1 (Debian python3-astropy), 8 cosmologies (flat, open, closed,
    // w0–wa, radiation with massive neutrinos, Einstein–de Sitter, empty) × 5 redshifts × 10 quantities.
    // Tolerance 1e-6 relative (the requirement; astropy's quad uses ~1.5e-8).
    [Theory]
    [MemberData(nameof(AstropyCases))]
    public void Matches_astropy_5_2_1(string caseName, double z, string quantity)
    {
        var row = AstropyRow.Load().Single(r => r.Case == caseName && r.Z == z);
        var c = new FlrwCosmology(row.Parameters);
        double actual = quantity switch
        {
            "dc" => c.ComovingDistanceMpc(z),
            "dm" => c.TransverseComovingDistanceMpc(z),
            "da" => c.AngularDiameterDistanceMpc(z),
            "dl" => c.LuminosityDistanceMpc(z),
            "mu" => c.DistanceModulusMag(z),
            "lookback" => c.LookbackTimeGyr(z),
            "age" => c.AgeGyr(z),
            "dvdz" => c.DifferentialComovingVolumeMpc3(z),
            "vc" => c.ComovingVolumeMpc3(z),
            "da_z1_z" => c.AngularDiameterDistanceMpc(row.Z1, z),
            _ => throw new ArgumentException(quantity),
        };
        AssertRelative.Equal(row.Values[quantity], actual, 1e-6, $"{caseName} {quantity}(z={z})");
    }

    // Exact analytic limit: Einstein–de Sitter (Ωm = 1, no Λ, no radiation):
    // D_C = 2 (c/H0) (1 − 1/√(1+z)) (Hogg 1999, astro-ph/9905116, §5).
    [Theory]
    [InlineData(0.1)]
    [InlineData(1.0)]
    [InlineData(3.0)]
    [InlineData(9.0)]
    public void EinsteinDeSitter_comoving_distance_matches_closed_form(double z)
    {
        var c = new FlrwCosmology(new CosmologyParameters { H0KmSMpc = 70, OmegaM0 = 1.0 });
        double dh = Units.SpeedOfLightKms / 70.0;
        AssertRelative.Equal(2 * dh * (1 - 1 / Math.Sqrt(1 + z)), c.ComovingDistanceMpc(z), 1e-11);
    }

    // Exact analytic limit: empty universe (Ωk = 1): D_L = (c/H0) z (1 + z/2) (Hogg 1999, eq. 21 and §5).
    [Theory]
    [InlineData(0.2)]
    [InlineData(1.0)]
    [InlineData(4.0)]
    public void Empty_universe_luminosity_distance_matches_closed_form(double z)
    {
        var c = new FlrwCosmology(new CosmologyParameters { H0KmSMpc = 70, OmegaM0 = 0.0, OmegaK0 = 1.0 });
        double dh = Units.SpeedOfLightKms / 70.0;
        AssertRelative.Equal(dh * z * (1 + z / 2), c.LuminosityDistanceMpc(z), 1e-11);
    }

    // Exact limits of the two-redshift distance: D_A(z, z) = 0 and D_A(0, z) = D_A(z) (Hogg 1999, eq. 19).
    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(0.1, 0.0)]
    [InlineData(-0.1, 0.0)]
    [InlineData(0.0, -0.9)]
    public void Two_redshift_distance_limits(double omegaK, double wa)
    {
        var c = new FlrwCosmology(new CosmologyParameters { OmegaK0 = omegaK, WA = wa });
        foreach (double z in new[] { 0.3, 1.0, 2.5 })
        {
            Assert.Equal(0.0, c.AngularDiameterDistanceMpc(z, z));
            AssertRelative.Equal(c.AngularDiameterDistanceMpc(z), c.AngularDiameterDistanceMpc(0, z), 1e-13);
        }
    }

    // Exact analytic limit: age of a flat ΛCDM universe without radiation,
    // t0 = (2 / (3 H0 √Ω_Λ)) asinh(√(Ω_Λ/Ωm)) (e.g. Peebles 1993, Principles of Physical Cosmology, eq. 13.20; from memory).
    [Theory]
    [InlineData(70.0, 0.3)]
    [InlineData(67.4, 0.315)]
    [InlineData(50.0, 0.05)]
    public void Flat_lcdm_age_matches_closed_form(double h0, double omegaM)
    {
        var c = new FlrwCosmology(new CosmologyParameters { H0KmSMpc = h0, OmegaM0 = omegaM });
        double omegaL = 1 - omegaM;
        double expected = 2.0 / (3.0 * Math.Sqrt(omegaL)) * Math.Asinh(Math.Sqrt(omegaL / omegaM)) * c.HubbleTimeGyr;
        AssertRelative.Equal(expected, c.AgeGyr(0), 1e-10);
        // lookback(z) + age(z) = age(0) is an identity of the definitions.
        AssertRelative.Equal(c.AgeGyr(0), c.AgeGyr(1.7) + c.LookbackTimeGyr(1.7), 1e-10);
    }

    [Fact]
    public void Reversed_two_redshift_distance_is_refused()
        => Assert.Throws<ArgumentOutOfRangeException>(() => new FlrwCosmology(new CosmologyParameters()).AngularDiameterDistanceMpc(1.0, 0.5));
}
