using Lightfold.Cosmology;
using Lightfold.Populations;
using Lightfold.Tests.Support;
using MathNet.Numerics;

namespace Lightfold.Tests.Populations;

public class OpticalDepthTests
{
    // External analytic result: the multiply-imaged optical depth of a non-evolving SIS population in a flat
    // universe is τ(z_s) = (F/30)(D_C(z_s)/D_H)³ with F = 16π³ D_H³ ⟨nσ⁴⟩/c⁴ (Turner, Ostriker & Gott 1984,
    // ApJ 284, 1; Fukugita & Turner 1991), and for the modified Schechter VDF ⟨nσ⁴⟩ = φ* σ*⁴ Γ((α+4)/β)/Γ(α/β).
    // The population machinery (cross-section table at q = 1, γ = 0; σ and z_d quadratures) must agree within
    // 0.5% over 0.5 ≤ z_s ≤ 5 (the bound). The σ range 1–3000 km/s and z_d from 1e-4 make the
    // truncation negligible (< 1e-6).
    [Theory]
    [InlineData(0.5)]
    [InlineData(1.0)]
    [InlineData(2.0)]
    [InlineData(3.5)]
    [InlineData(5.0)]
    public void Sis_population_matches_turner_ostriker_gott(double zSource)
    {
        var cosmology = new FlrwCosmology(new CosmologyParameters());
        var vdf = new VelocityDispersionFunction();
        var deflectors = new DeflectorPopulation
        {
            Vdf = vdf, SigmaMinKms = 1, SigmaMaxKms = 3000, ZMin = 1e-4, ZMax = 10,
            AxisRatio = new AxisRatioDistribution { Min = 1.0, Max = 1.0 }, Shear = new ShearDistribution { Median = 0 },
        };
        var sources = new SourcePopulation { ZMin = 0.1, ZMax = 5.5, Types = [TransientType.Ia] };
        var yield = new LensingYield(cosmology, deflectors, sources, new SurveyWindow());

        double h = 0.7, dh = Units.SpeedOfLightKms / 70.0, c = Units.SpeedOfLightKms;
        double nSigma4 = vdf.PhiStarH3PerMpc3 * h * h * h * Math.Pow(vdf.SigmaStarKms, 4)
                         * SpecialFunctions.Gamma((vdf.Alpha + 4) / vdf.Beta) / SpecialFunctions.Gamma(vdf.Alpha / vdf.Beta);
        double f = 16 * Math.Pow(Math.PI, 3) * Math.Pow(dh, 3) * nSigma4 / Math.Pow(c, 4);
        double expected = f / 30 * Math.Pow(cosmology.ComovingDistanceMpc(zSource) / dh, 3);
        AssertRelative.Equal(expected, yield.OpticalDepth(zSource), 5e-3, $"τ(z_s = {zSource})");
        // REFERENCES.md §2 [D]: F = 0.0099 for the Choi et al. 2007 parameters.
        AssertRelative.Equal(0.0099, f, 5e-3, "F");
    }

    // Star-formation history of Madau & Dickinson 2014 (eq. 15): 0.015 (to rounding: 0.014961) at z = 0 and a
    // peak near z ≈ 1.9 (the paper's abstract; the formula's maximum is at z = 1.863, REFERENCES.md [D]).
    [Fact]
    public void Madau_dickinson_density_today_and_peak()
    {
        AssertRelative.Equal(0.014961, StarFormationHistory.MadauDickinson2014(0), 1e-4);
        AssertRelative.Equal(0.08665, StarFormationHistory.MadauDickinson2014(1), 1e-4);
        double best = 0, zPeak = 0;
        for (double z = 0; z < 6; z += 1e-4)
        {
            double v = StarFormationHistory.MadauDickinson2014(z);
            if (v > best) { best = v; zPeak = z; }
        }
        AssertRelative.Near(1.863, zPeak, 2e-3);
        Assert.InRange(zPeak, 1.8, 2.0);   // "near z ≈ 1.9"
    }

    // VDF normalisation identity ∫φ dσ = φ* (REFERENCES.md §3, exact) by direct numerical integration.
    [Fact]
    public void Vdf_integrates_to_phi_star()
    {
        var vdf = new VelocityDispersionFunction();
        double total = Lightfold.Numerics.Quadrature.Integrate(s => vdf.DensityPerKms(s, 0, 0.7), 1e-3, 2000, 1e-12);
        AssertRelative.Equal(vdf.PhiStarH3PerMpc3 * 0.343, total, 1e-8);
        AssertRelative.Equal(vdf.PhiStarH3PerMpc3 * 0.343, vdf.Moment(0, 0, 1e-9, 1e6, 0.7), 1e-10);
    }
}
