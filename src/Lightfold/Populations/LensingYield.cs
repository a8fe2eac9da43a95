using Lightfold.Cosmology;
using Lightfold.Lensing;
using Lightfold.Numerics;
using Lightfold.Randomness;

namespace Lightfold.Populations;

/// <summary>Expected numbers of unlensed and multiply-imaged events, and the exact samplers that go with them.</summary>
/// <remarks>
/// The multiply-imaged fraction of sources at z_s (the lensing optical depth) is
/// τ(z_s) = ⟨a⟩ ∫ dz_d (dV_C/dz_d dΩ) ∫ dσ φ(σ, z_d) θ_E²(σ, z_d, z_s), with θ_E = 4π (σ/c)² D_ds/D_s and ⟨a⟩ the
/// mean over axis ratio, shear and shear angle of the SIE + shear cross-section in units of θ_E² (from
/// <see cref="CrossSectionTable"/>); for SIS lenses without evolution this reduces to (F/30)(D_C/D_H)³ of Turner,
/// Ostriker &amp; Gott 1984 (ApJ 284, 1). Expected events of a type: N = Ω T ∫ dz_s R(z_s)/(1 + z_s) (dV_C/dz_s dΩ) τ(z_s),
/// the 1/(1+z) being time dilation of the rest-frame rate. Integrals: Simpson's rule on a 1200-point source grid and
/// 48 Gauss–Legendre panels in z_d — deterministic quadrature. The σ integral is the incomplete-gamma closed form.
/// Sampling draws exactly from the integrands: the type ∝ its expected count, z_s from the tabulated integrand, z_d by
/// rejection from dV/dz_d ⟨nσ⁴⟩(z_d) with acceptance (D_ds/D_s)², σ ∝ φ σ⁴, and (q, γ, Δ) ∝ prior × cross-section.
/// </remarks>
public sealed class LensingYield
{
    const int SourceGrid = 1200, DeflectorGrid = 2400, Panels = 48;
    static readonly double[] GlNodes = [0.183434642495649805, 0.525532409916328986, 0.796666477413626740, 0.960289856497536232];
    static readonly double[] GlWeights = [0.362683783378361983, 0.313706645877887287, 0.222381034453374471, 0.101228536290376259];

    readonly FlrwCosmology cosmology;
    readonly DistanceTable distances;
    readonly DeflectorPopulation deflectors;
    readonly SourcePopulation sources;
    readonly double littleH;
    readonly double[] zs;                 // source grid
    readonly double[] depthKernel;        // ∫ dz_d dV/dz_d ⟨φσ⁴⟩ (4π/c²)² (D_ds/D_s)², per source grid point (without ⟨a⟩)
    readonly Dictionary<TransientType, double[]> sourceCdf = [];
    readonly Dictionary<TransientType, double[]> unlensedCdf = [];
    double[] unlensedTypeCdf = [];
    readonly double[] zd;                 // deflector proposal grid
    readonly double[] deflectorCdf;       // cumulative of dV/dz_d ⟨φσ⁴⟩(z_d)
    readonly TransientType[] types;
    readonly double[] typeCdf;
    readonly CrossSectionTable table;
    readonly double shapeBound;

    /// <summary>Computes every integral; about 0.1 s plus the first use of the cross-section table.</summary>
    /// <param name="cosmology">Distances.</param>
    /// <param name="deflectors">Lens population.</param>
    /// <param name="sources">Transient population.</param>
    /// <param name="survey">Footprint and window.</param>
    /// <param name="table">Cross-section lookup (the pipeline passes its disk-cached copy; default: computed in memory).</param>
    public LensingYield(FlrwCosmology cosmology, DeflectorPopulation deflectors, SourcePopulation sources, SurveyWindow survey, CrossSectionTable? table = null)
    {
        this.cosmology = cosmology;
        distances = cosmology.Table;
        this.deflectors = deflectors;
        this.sources = sources;
        Survey = survey;
        littleH = cosmology.Parameters.LittleH;
        this.table = table ?? CrossSectionTable.Shared;
        PrepareMoment4();
        (MeanAreaTwo, MeanAreaFour) = MeanCrossSections();
        shapeBound = 1.001 * this.table.MaxAtLeastTwo;
        Rates = new VolumetricRates(sources.Rates, cosmology, sources.ZMax);

        // Deflector proposal: dV/dz_d ⟨φσ⁴⟩(z_d) on [z_min, z_max].
        zd = new double[DeflectorGrid + 1];
        deflectorCdf = new double[DeflectorGrid + 1];
        double zdHi = Math.Min(deflectors.ZMax, sources.ZMax);
        double previous = 0;
        for (int i = 0; i <= DeflectorGrid; i++)
        {
            zd[i] = deflectors.ZMin + (zdHi - deflectors.ZMin) * i / DeflectorGrid;
            double g = distances.DifferentialComovingVolumeMpc3(zd[i]) * SigmaMoment4(zd[i]);
            if (i > 0) deflectorCdf[i] = deflectorCdf[i - 1] + 0.5 * (g + previous) * (zd[i] - zd[i - 1]);
            previous = g;
        }

        zs = new double[SourceGrid + 1];
        depthKernel = new double[SourceGrid + 1];
        for (int i = 0; i <= SourceGrid; i++)
        {
            zs[i] = sources.ZMin + (sources.ZMax - sources.ZMin) * i / SourceGrid;
            depthKernel[i] = DepthKernel(zs[i]);
        }

        var expected = new List<double>();
        types = [.. sources.Types];
        foreach (var type in types)
        {
            var integrand = new double[SourceGrid + 1];
            var unlensed = new double[SourceGrid + 1];
            for (int i = 0; i <= SourceGrid; i++)
            {
                double perZ = survey.SolidAngleSr * survey.ExplosionYears * Rates.RestFrameRate(type, zs[i]) / (1 + zs[i])
                              * distances.DifferentialComovingVolumeMpc3(zs[i]);
                unlensed[i] = perZ;
                integrand[i] = perZ * depthKernel[i];
            }
            double lensedKernel = Simpson(integrand);
            var cdf = new double[SourceGrid + 1];
            for (int i = 1; i <= SourceGrid; i++) cdf[i] = cdf[i - 1] + 0.5 * (integrand[i] + integrand[i - 1]) * (zs[i] - zs[i - 1]);
            for (int i = 0; i <= SourceGrid; i++) cdf[i] /= cdf[SourceGrid] > 0 ? cdf[SourceGrid] : 1;
            sourceCdf[type] = cdf;
            var ucdf = new double[SourceGrid + 1];
            for (int i = 1; i <= SourceGrid; i++) ucdf[i] = ucdf[i - 1] + 0.5 * (unlensed[i] + unlensed[i - 1]) * (zs[i] - zs[i - 1]);
            for (int i = 0; i <= SourceGrid; i++) ucdf[i] /= ucdf[SourceGrid] > 0 ? ucdf[SourceGrid] : 1;
            unlensedCdf[type] = ucdf;
            ByType[type] = new TypeYield(type, Simpson(unlensed), MeanAreaTwo * lensedKernel, MeanAreaFour * lensedKernel);
            expected.Add(MeanAreaTwo * lensedKernel);
        }
        TotalLensed = expected.Sum();
        TotalUnlensed = ByType.Values.Sum(y => y.Unlensed);
        unlensedTypeCdf = new double[types.Length];
        double accU = 0;
        for (int i = 0; i < types.Length; i++)
        {
            accU += ByType[types[i]].Unlensed;
            unlensedTypeCdf[i] = TotalUnlensed > 0 ? accU / TotalUnlensed : (i + 1.0) / types.Length;
        }
        typeCdf = new double[types.Length];
        double acc = 0;
        for (int i = 0; i < types.Length; i++)
        {
            acc += expected[i];
            typeCdf[i] = TotalLensed > 0 ? acc / TotalLensed : (i + 1.0) / types.Length;
        }
    }

    /// <summary>The survey window the counts refer to.</summary>
    public SurveyWindow Survey { get; }

    /// <summary>Rates used.</summary>
    public VolumetricRates Rates { get; }

    /// <summary>Mean cross-section with ≥ 2 images over the shape and shear distributions [θ_E²].</summary>
    public double MeanAreaTwo { get; }

    /// <summary>Mean cross-section with ≥ 4 images [θ_E²].</summary>
    public double MeanAreaFour { get; }

    /// <summary>Expected counts per type over the explosion window (window plus lead-in).</summary>
    public Dictionary<TransientType, TypeYield> ByType { get; } = [];

    /// <summary>Expected multiply-imaged events of all types over the explosion window.</summary>
    public double TotalLensed { get; }

    /// <summary>Expected events of all types, lensed or not, over the explosion window.</summary>
    public double TotalUnlensed { get; }

    /// <summary>Draws a type in proportion to its expected number of events (unlensed).</summary>
    public TransientType SampleUnlensedType(ref KeyedRandom rng) => Tabulated.Pick(types, unlensedTypeCdf, rng.NextDouble());

    /// <summary>Draws z from R/(1+z) dV/dz of <paramref name="type"/> (an unlensed event).</summary>
    public double SampleUnlensedRedshift(TransientType type, ref KeyedRandom rng)
        => Tabulated.InverseCdf(zs, unlensedCdf[type], rng.NextDouble());

    /// <summary>Multiply-imaged fraction of sources at z_s (the optical depth for ≥ 2 images).</summary>
    public double OpticalDepth(double zSource) => MeanAreaTwo * DepthKernel(zSource);

    /// <summary>∫ φ(σ, z) σ⁴ dσ over the configured σ range [Mpc⁻³ (km/s)⁴]; constant without evolution, else
    /// interpolated from 1024 nodes (the evolution is a smooth power law: linear interpolation error &lt; 1e-6).</summary>
    double SigmaMoment4(double z)
    {
        if (moment4Grid is null) return moment4Constant;
        double u = (z - deflectors.ZMin) / (moment4Top - deflectors.ZMin) * (moment4Grid.Length - 1);
        int i = Math.Clamp((int)u, 0, moment4Grid.Length - 2);
        double f = u - i;
        return moment4Grid[i] + f * (moment4Grid[i + 1] - moment4Grid[i]);
    }

    double moment4Constant, moment4Top;
    double[]? moment4Grid;

    void PrepareMoment4()
    {
        var vdf = deflectors.Vdf;
        if (vdf.PhiStarEvolution == 0 && vdf.SigmaStarEvolution == 0)
        {
            moment4Constant = vdf.Moment(4.0, 0.0, deflectors.SigmaMinKms, deflectors.SigmaMaxKms, littleH);
            return;
        }
        moment4Top = Math.Max(deflectors.ZMax, deflectors.ZMin + 1e-3);
        moment4Grid = new double[1024];
        for (int i = 0; i < moment4Grid.Length; i++)
            moment4Grid[i] = vdf.Moment(4.0, deflectors.ZMin + (moment4Top - deflectors.ZMin) * i / (moment4Grid.Length - 1),
                deflectors.SigmaMinKms, deflectors.SigmaMaxKms, littleH);
    }

    double DepthKernel(double zSource)
    {
        double lo = deflectors.ZMin, hi = Math.Min(deflectors.ZMax, zSource);
        if (hi <= lo) return 0;
        double c4 = Math.Pow(4 * Math.PI / (Units.SpeedOfLightKms * Units.SpeedOfLightKms), 2);
        double ds = distances.AngularDiameterDistanceMpc(zSource), sum = 0, width = (hi - lo) / Panels;
        for (int p = 0; p < Panels; p++)
        {
            double centre = lo + (p + 0.5) * width, half = 0.5 * width;
            for (int j = 0; j < 4; j++)
                foreach (double sign in (ReadOnlySpan<double>)[-1.0, 1.0])
                {
                    double z = centre + sign * half * GlNodes[j];
                    double ratio = distances.AngularDiameterDistanceMpc(z, zSource) / ds;
                    sum += GlWeights[j] * half * distances.DifferentialComovingVolumeMpc3(z) * SigmaMoment4(z) * c4 * ratio * ratio;
                }
        }
        return sum;
    }

    // ⟨a₂⟩, ⟨a₄⟩ over q (truncated normal), γ (log-normal) and Δ (uniform), by Gauss–Legendre products
    // (48 × 64 × 16 nodes; the integrands are smooth, so this is converged far below the table's 0.5%).
    (double Two, double Four) MeanCrossSections()
    {
        var qd = deflectors.AxisRatio;
        var sd = deflectors.Shear;
        var qNodes = qd.IsFixed ? [(qd.Min, 1.0)] : Nodes(qd.Min, qd.Max, 6).Select(n => (n.X, n.W * qd.Density(n.X))).ToList();
        List<(double X, double W)> gNodes;
        if (sd.IsOff) gNodes = [(0.0, 1.0)];
        else
        {
            double lgMax = Math.Log10(sd.Max), lgMin = Math.Log10(sd.Median) - 6 * sd.SigmaDex;
            gNodes = Nodes(lgMin, lgMax, 8).Select(n => (Math.Pow(10, n.X), n.W * sd.Density(Math.Pow(10, n.X)) * Math.Pow(10, n.X) * Math.Log(10))).ToList();
        }
        var aNodes = Nodes(0, 90, 2);
        double two = 0, four = 0, norm = 0;
        foreach (var (q, wq) in qNodes)
            foreach (var (g, wg) in gNodes)
                foreach (var (a, wa) in aNodes)
                {
                    var cs = table.Lookup(q, g, a);
                    double w = wq * wg * wa;
                    two += w * cs.AtLeastTwo;
                    four += w * cs.AtLeastFour;
                    norm += w;
                }
        return (two / norm, four / norm);
    }

    static List<(double X, double W)> Nodes(double a, double b, int panels)
    {
        var list = new List<(double, double)>();
        double width = (b - a) / panels;
        for (int p = 0; p < panels; p++)
        {
            double centre = a + (p + 0.5) * width, half = 0.5 * width;
            for (int j = 0; j < 4; j++)
            {
                list.Add((centre - half * GlNodes[j], half * GlWeights[j]));
                list.Add((centre + half * GlNodes[j], half * GlWeights[j]));
            }
        }
        return list;
    }

    double Simpson(double[] y)
    {
        double h = (sources.ZMax - sources.ZMin) / SourceGrid, sum = y[0] + y[SourceGrid];
        for (int i = 1; i < SourceGrid; i++) sum += (i % 2 == 1 ? 4 : 2) * y[i];
        return sum * h / 3;
    }

    /// <summary>Draws a type in proportion to its expected number of lensed events.</summary>
    public TransientType SampleType(ref KeyedRandom rng) => Tabulated.Pick(types, typeCdf, rng.NextDouble());

    /// <summary>Draws z_s from the lensed-event integrand of <paramref name="type"/>.</summary>
    public double SampleSourceRedshift(TransientType type, ref KeyedRandom rng)
        => Tabulated.InverseCdf(zs, sourceCdf[type], rng.NextDouble());

    /// <summary>Draws z_d for a source at z_s from dV/dz_d ⟨φσ⁴⟩(z_d) (D_ds/D_s)², by rejection.</summary>
    public double SampleDeflectorRedshift(double zSource, ref KeyedRandom rng)
    {
        double top = Tabulated.Interpolate(zd, deflectorCdf, Math.Min(zSource, zd[^1]));
        double ds = distances.AngularDiameterDistanceMpc(zSource);
        for (int attempt = 0; attempt < 100_000; attempt++)
        {
            double z = Tabulated.InverseCdf(zd, deflectorCdf, rng.NextDouble() * top / deflectorCdf[^1]);
            double ratio = distances.AngularDiameterDistanceMpc(z, zSource) / ds;
            if (rng.NextDouble() < ratio * ratio) return z;
        }
        throw new InvalidOperationException($"deflector redshift rejection did not converge for z_s = {zSource}");
    }

    /// <summary>Draws σ ∝ φ(σ, z_d) σ⁴ within the configured range.</summary>
    public double SampleSigma(double zDeflector, ref KeyedRandom rng)
        => deflectors.Vdf.SampleLensingWeighted(zDeflector, deflectors.SigmaMinKms, deflectors.SigmaMaxKms, ref rng);

    /// <summary>Draws (q, γ, Δ) ∝ prior × ≥2-image cross-section; returns the lookup's cross-section for them.</summary>
    public CrossSection SampleShape(ref KeyedRandom rng, out double axisRatio, out double shearGamma, out double relativeShearDeg)
    {
        for (int attempt = 0; attempt < 100_000; attempt++)
        {
            axisRatio = deflectors.AxisRatio.Sample(ref rng);
            shearGamma = deflectors.Shear.Sample(ref rng);
            relativeShearDeg = 180.0 * rng.NextDouble();
            var cs = table.Lookup(axisRatio, shearGamma, relativeShearDeg);
            if (rng.NextDouble() * shapeBound < cs.AtLeastTwo) return cs;
        }
        throw new InvalidOperationException("shape rejection did not converge");
    }


}

/// <summary>Expected events of one type over the explosion window.</summary>
/// <param name="Type">Transient type.</param>
/// <param name="Unlensed">All events in the footprint and source-redshift range (lensed or not).</param>
/// <param name="Lensed">Multiply imaged (≥ 2 images).</param>
/// <param name="Quads">With ≥ 4 images.</param>
public sealed record TypeYield(TransientType Type, double Unlensed, double Lensed, double Quads);
