using Lightfold.Numerics;
using Lightfold.Photometry;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Photometry;

public class SyntheticPhotometryTests
{
    public static TheoryData<string> Bands() => ["u", "g", "r", "i", "z", "y", "B"];

    static Bandpass Band(string name) => name == "B" ? BuiltInBands.RestFrameB : (BuiltInBands.TryGet(name, out var b) ? b : throw new ArgumentException(name));

    // Definition of the AB system (Oke & Gunn 1983, ApJ 266, 713): a flat f_ν of 3631 Jy has m_AB = 0 in every
    // band. 3631 Jy differs from 10^(−48.6/2.5) erg/s/cm²/Hz = 3630.78 Jy by 6.6e-5 mag, hence the 1e-4 tolerance.
    [Theory]
    [MemberData(nameof(Bands))]
    public void Flat_3631_jansky_spectrum_has_ab_magnitude_zero(string name)
    {
        double fnu = 3631e-23;   // erg/s/cm²/Hz
        double m = SyntheticPhotometry.AbMagnitude(SyntheticPhotometry.FluxNu(Band(name), l => fnu * Units.SpeedOfLightAngstromPerS / (l * l)));
        AssertRelative.Near(0.0, m, 1e-4);
        AssertRelative.Near(31.4, SyntheticPhotometry.MagnitudeFromNjy(1.0), 1e-12);
    }

    // A blackbody's synthetic colour against direct adaptive integration of the Planck function through the analytic
    // band shape (the tanh top-hat the band was sampled from), 1e-4 mag.
    [Theory]
    [InlineData(4000.0)]
    [InlineData(7000.0)]
    [InlineData(12000.0)]
    [InlineData(30000.0)]
    public void Blackbody_colours_match_direct_integration(double temperatureK)
    {
        static double Direct(double t, double l1, double l2, double w)
        {
            double Tb(double l) => 0.5 * (Math.Tanh((l - l1) / w) - Math.Tanh((l - l2) / w));
            double num = Quadrature.Integrate(l => SyntheticPhotometry.PlanckLambda(t, l) * Tb(l) * l, l1 - 4 * w, l2 + 4 * w, 1e-12);
            double den = Quadrature.Integrate(l => Tb(l) / l, l1 - 4 * w, l2 + 4 * w, 1e-12) * Units.SpeedOfLightAngstromPerS;
            return SyntheticPhotometry.AbMagnitude(num / den);
        }
        double gr = Direct(temperatureK, 4000, 5500, 60) - Direct(temperatureK, 5500, 6900, 60);
        BuiltInBands.TryGet("g", out var g);
        BuiltInBands.TryGet("r", out var r);
        double mine = SyntheticPhotometry.AbMagnitude(SyntheticPhotometry.FluxNu(g, l => SyntheticPhotometry.PlanckLambda(temperatureK, l)))
                      - SyntheticPhotometry.AbMagnitude(SyntheticPhotometry.FluxNu(r, l => SyntheticPhotometry.PlanckLambda(temperatureK, l)));
        AssertRelative.Near(gr, mine, 1e-4, $"g − r at {temperatureK} K");
    }

    // The tabulated band flux of a redshifted, UV-suppressed blackbody agrees with direct synthetic photometry
    // within 0.2% at 400 random (T, z) points (internal check of the interpolation).
    [Fact]
    public void Blackbody_band_table_matches_direct_photometry()
    {
        var uv = new Lightfold.Transients.UvSuppression();
        BuiltInBands.TryGet("i", out var band);
        var table = new BlackbodyBandTable(band, uv.Factor, 3.0);
        var rng = Lightfold.Randomness.KeyedRandom.For(3, 0, Lightfold.Randomness.Stage.Population);
        for (int k = 0; k < 400; k++)
        {
            double t = Math.Exp(rng.Uniform(Math.Log(3000), Math.Log(40000))), z = rng.Uniform(0, 3);
            double direct = SyntheticPhotometry.FluxNu(band, l => SyntheticPhotometry.PlanckLambda(t, l / (1 + z)) * uv.Factor(l / (1 + z)));
            AssertRelative.Equal(direct, table.Evaluate(t, z), 2e-3, $"T = {t}, z = {z}");
        }
    }

    // Cardelli, Clayton & Mathis 1989: A(λ)/A(V) = 1 at V (x = 1.82 μm⁻¹ exactly makes y = 0), and
    // A(B) − A(V) ≈ E(B−V) at the B and V effective wavelengths (the law's normalisation; ~3% allowed for the
    // choice of effective wavelengths 4400 and 5500 Å, common practice).
    [Fact]
    public void Ccm89_is_normalised_to_v_and_to_the_colour_excess()
    {
        AssertRelative.Near(1.0, Extinction.RelativeToV(1e4 / 1.82, 3.1), 1e-12);
        double ebv = 0.2;
        double diff = Extinction.Magnitudes(4400, ebv, 3.1) - Extinction.Magnitudes(5500, ebv, 3.1);
        AssertRelative.Equal(ebv, diff, 0.03);
        Assert.True(Extinction.RelativeToV(2000, 3.1) > 2.0, "strong UV extinction");
    }
}
