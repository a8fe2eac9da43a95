using Lightfold.Configuration;
using Lightfold.Cosmology;
using Lightfold.Lensing;
using Lightfold.Populations;
using Lightfold.Randomness;

namespace Lightfold.Pipeline;

/// <summary>Draws and solves lensed systems by id: pure given the scenario (every draw keyed by seed, id and stage).</summary>
/// <remarks>Immutable after construction and safe to share across threads.</remarks>
public sealed class SystemSampler
{
    readonly Scenario scenario;
    readonly DistanceTable distances;

    /// <summary>Prepares cosmology, yields and samplers for <paramref name="scenario"/>.</summary>
    public SystemSampler(Scenario scenario)
    {
        this.scenario = scenario;
        Cosmology = new FlrwCosmology(scenario.Cosmology);
        distances = Cosmology.Table;
        Yield = new LensingYield(Cosmology, scenario.Deflectors, scenario.Sources, scenario.Survey, Catalog.CrossSectionTableCache.Shared);
    }

    /// <summary>The cosmology of the scenario.</summary>
    public FlrwCosmology Cosmology { get; }

    /// <summary>Expected counts and samplers.</summary>
    public LensingYield Yield { get; }

    /// <summary>How many systems the run has and the weight of each: N and Λ/N (oversample), or a Poisson N and 1 (realization).</summary>
    public (long Count, double Weight) RunSize()
    {
        if (scenario.Run.Mode is RunMode.Oversample or RunMode.Training)
            return (scenario.Run.Count, Yield.TotalLensed / scenario.Run.Count);
        var rng = KeyedRandom.For(scenario.Seed, 0, Stage.EventCount);
        return (rng.Poisson(Yield.TotalLensed), 1.0);
    }

    /// <summary>Draws system <paramref name="systemId"/> and solves its lens equation.</summary>
    /// <remarks>In training mode each id is lensed with the configured probability (its own keyed stream) and otherwise an
    /// unlensed transient; weights then stand for the expected events of the row's class.</remarks>
    public void Draw(long systemId, double weight, ref LensedSystem s)
    {
        if (scenario.Run.Mode == RunMode.Training)
        {
            var t = scenario.Run.Training;
            var label = KeyedRandom.For(scenario.Seed, systemId, Stage.Unlensed, 1);
            if (label.NextDouble() >= t.LensedFraction)
            {
                DrawUnlensed(systemId, Yield.TotalUnlensed / (scenario.Run.Count * (1 - t.LensedFraction)), ref s);
                return;
            }
            weight = Yield.TotalLensed / (scenario.Run.Count * t.LensedFraction);
        }
        var rng = KeyedRandom.For(scenario.Seed, systemId, Stage.Population);
        s.SystemId = systemId;
        s.Weight = weight;
        s.Lensed = true;
        s.Type = Yield.SampleType(ref rng);
        s.ZSource = Yield.SampleSourceRedshift(s.Type, ref rng);
        s.ZLens = Yield.SampleDeflectorRedshift(s.ZSource, ref rng);
        s.SigmaVKms = Yield.SampleSigma(s.ZLens, ref rng);
        var cs = Yield.SampleShape(ref rng, out double q, out double gamma, out double delta);
        double pa = 180.0 * rng.NextDouble();
        double dds = distances.AngularDiameterDistanceMpc(s.ZLens, s.ZSource), dsrc = distances.AngularDiameterDistanceMpc(s.ZSource);
        double thetaE = EinsteinRadius.IsothermalArcsec(s.SigmaVKms, dds / dsrc);
        s.Lens = new SieShearLens
        {
            ThetaEArcsec = thetaE, AxisRatio = q, PositionAngleDeg = pa,
            ShearGamma = gamma, ShearPositionAngleDeg = (pa + delta) % 180.0,
        };
        s.TimeDelayDistanceMpc = (1 + s.ZLens) * distances.AngularDiameterDistanceMpc(s.ZLens) * dsrc / dds;

        // Source uniform inside the multiply-imaged region: uniform in a disk that bounds it, kept when ≥ 2 images.
        var kernel = new SieKernel(s.Lens);
        double radius = cs.MaxRadius * thetaE;
        Span<LensedImage> images = s.Images;
        for (int attempt = 0; ; attempt++)
        {
            if (attempt == 100_000) throw new InvalidOperationException($"system {systemId}: no multiply-imaged source position found");
            double r = radius * Math.Sqrt(rng.NextDouble()), phi = 2 * Math.PI * rng.NextDouble();
            double bx = r * Math.Cos(phi), by = r * Math.Sin(phi);
            if (!ImageFinder.TryFindImages(in kernel, bx, by, images, out int n, out var status) || n < 2) continue;
            s.SourceXArcsec = bx;
            s.SourceYArcsec = by;
            s.ImageCount = n;
            s.Status = status;
            break;
        }
        double daysPerArcsec2 = TimeDelays.DaysPerArcsec2(s.TimeDelayDistanceMpc);
        for (int i = 0; i < s.ImageCount; i++) s.DelaysDays[i] = images[i].RelativeFermatArcsec2 * daysPerArcsec2;

        // Stellar convergence at each image (the lens's elliptical radius, its effective radius from σ_v).
        double dLens = distances.AngularDiameterDistanceMpc(s.ZLens);
        var stellar = scenario.Microlensing.Stellar;
        double re = stellar.EffectiveRadiusArcsec(s.SigmaVKms, dLens);
        double phiL = Units.DegToRad(90 - s.Lens.PositionAngleDeg);
        for (int i = 0; i < s.ImageCount; i++)
        {
            double x = images[i].XArcsec, y = images[i].YArcsec;
            double xl = x * Math.Cos(phiL) + y * Math.Sin(phiL), yl = -x * Math.Sin(phiL) + y * Math.Cos(phiL);
            double elliptical = Math.Sqrt(q * xl * xl + yl * yl / q);
            s.KappaStars[i] = stellar.KappaStar(images[i].Kappa, elliptical, thetaE, re);
        }
        s.MicroEinsteinRadiusCm = Microlensing.MicrolensingSettings.EinsteinRadiusCm(dLens, dsrc, dds);

        DrawTransient(systemId, ref s);
    }

    void DrawTransient(long systemId, ref LensedSystem s)
    {
        var transient = KeyedRandom.For(scenario.Seed, systemId, Stage.Transient);
        var survey = scenario.Survey;
        s.T0Mjd = survey.StartMjd - survey.LeadInDays + (survey.EndMjd - survey.StartMjd + survey.LeadInDays) * transient.NextDouble();
        var peak = scenario.Sources.PeakMagnitudes[s.Type];
        s.PeakAbsoluteBMag = transient.Normal(peak.Mean, peak.Sigma);
    }

    /// <summary>An unlensed transient from the same rates and luminosity functions: one image, μ = 1, no lens.</summary>
    public void DrawUnlensed(long systemId, double weight, ref LensedSystem s)
    {
        var rng = KeyedRandom.For(scenario.Seed, systemId, Stage.Unlensed);
        s.SystemId = systemId;
        s.Weight = weight;
        s.Lensed = false;
        s.Type = Yield.SampleUnlensedType(ref rng);
        s.ZSource = Yield.SampleUnlensedRedshift(s.Type, ref rng);
        s.ZLens = s.SigmaVKms = s.TimeDelayDistanceMpc = double.NaN;
        s.Lens = null;
        s.SourceXArcsec = s.SourceYArcsec = 0;
        s.ImageCount = 1;
        s.Status = ImageSetStatus.Regular;
        s.Images[0] = new LensedImage(0, 0, 1.0, 0, 0, 0, 0, 0);
        s.DelaysDays[0] = 0;
        s.KappaStars[0] = 0;
        s.MicroEinsteinRadiusCm = 0;
        DrawTransient(systemId, ref s);
    }
}
