using Lightfold.Cosmology;
using Lightfold.Populations;

namespace Lightfold.Configuration;

/// <summary>Maps configuration keys onto the scenario's records; the only place key names are spelled.</summary>
public static class ScenarioBinder
{
    /// <summary>Reads every section of the scenario.</summary>
    public static Scenario Bind(ConfigReader r)
    {
        var run = r.Section("run");
        string name = run.Text("name", 120);
        ulong seed = run.UInt64("seed");
        var settings = new RunSettings
        {
            Mode = run.Choice("mode", "oversample", "realization") == "oversample" ? RunMode.Oversample : RunMode.Realization,
            Count = run.Long("count", 1, 10_000_000_000),
            BatchSize = run.Int("batch_size", 1, 4_000_000),
        };
        var cosmology = BindCosmology(r.Section("cosmology"));
        var survey = BindSurvey(r.Section("survey"));
        var sources = BindSources(r.Section("sources"));
        var deflectors = BindDeflectors(r.Section("deflectors"));
        if (deflectors.ZMin >= sources.ZMax)
            throw new InputException($"config key 'deflectors.z_min' = {deflectors.ZMin} must be below 'sources.z_max' = {sources.ZMax}");
        return new Scenario
        {
            Name = name,
            Seed = seed,
            Run = settings,
            Cosmology = cosmology,
            Survey = survey,
            Deflectors = deflectors,
            Sources = sources,
        };
    }

    static CosmologyParameters BindCosmology(ConfigReader c)
    {
        var p = new CosmologyParameters
        {
            H0KmSMpc = c.Double("h0_kms_mpc", 1.0, 1000.0, "km/s/Mpc"),
            OmegaM0 = c.Double("omega_m0", 0.0, 10.0),
            OmegaK0 = c.Double("omega_k0", -2.0, 2.0),
            W0 = c.Double("w0", -5.0, 1.0),
            WA = c.Double("wa", -5.0, 5.0),
            TcmbK = c.Double("tcmb0_k", 0.0, 100.0, "K (0 = no radiation)"),
            Neff = c.Double("neff", 0.0, 20.0),
            NeutrinoMassesEv = [.. c.DoubleList("neutrino_masses_ev", 0.0, 10.0, 0, 20)],
        };
        int species = (int)Math.Floor(p.Neff);
        if (p.NeutrinoMassesEv.Length != 0 && p.NeutrinoMassesEv.Length != species)
            throw new InputException($"config key 'cosmology.neutrino_masses_ev' has {p.NeutrinoMassesEv.Length} values: expected none (massless) or floor(neff) = {species}");
        // A universe that recollapses before today, or has no big bang, cannot be integrated.
        var cosmology = new FlrwCosmology(p);
        for (double a = 1.0; a > 1e-4; a *= 0.9)
        {
            double hubble = cosmology.E(1.0 / a - 1.0);
            if (!(hubble > 0))
                throw new InputException($"cosmology (omega_m0 = {p.OmegaM0}, omega_k0 = {p.OmegaK0}, w0 = {p.W0}, wa = {p.WA}) has H(z)² ≤ 0 at z = {1.0 / a - 1.0:F3}: not a valid expanding universe");
        }
        return p;
    }

    static SurveyWindow BindSurvey(ConfigReader s)
    {
        var w = new SurveyWindow
        {
            Name = s.Text("name", 120),
            AreaDeg2 = s.Double("area_deg2", 1e-6, Units.SquareDegreesWholeSky, "deg²"),
            StartMjd = s.Double("start_mjd", 0, 100_000, "MJD"),
            EndMjd = s.Double("end_mjd", 0, 100_000, "MJD"),
            LeadInDays = s.Double("lead_in_days", 0, 3650, "days"),
        };
        if (w.EndMjd <= w.StartMjd)
            throw new InputException($"config key 'survey.end_mjd' = {w.EndMjd} must be after 'survey.start_mjd' = {w.StartMjd}");
        return w;
    }

    static DeflectorPopulation BindDeflectors(ConfigReader d)
    {
        double zMin = d.Double("z_min", 1e-3, 10), zMax = d.Double("z_max", 1e-3, 10);
        if (zMax <= zMin) throw new InputException($"config key 'deflectors.z_max' = {zMax} must exceed 'deflectors.z_min' = {zMin}");
        double sMin = d.Double("sigma_min_kms", 1, 2000, "km/s"), sMax = d.Double("sigma_max_kms", 1, 2000, "km/s");
        if (sMax <= sMin) throw new InputException($"config key 'deflectors.sigma_max_kms' = {sMax} must exceed 'deflectors.sigma_min_kms' = {sMin}");
        var v = d.Section("vdf");
        var vdf = new VelocityDispersionFunction
        {
            PhiStarH3PerMpc3 = v.Double("phi_star_h3_per_mpc3", 1e-9, 1.0, "h³ Mpc⁻³"),
            SigmaStarKms = v.Double("sigma_star_kms", 1, 2000, "km/s"),
            Alpha = v.Double("alpha", 1e-3, 50),
            Beta = v.Double("beta", 1e-2, 20),
            PhiStarEvolution = v.Double("phi_star_evolution", -10, 10),
            SigmaStarEvolution = v.Double("sigma_star_evolution", -5, 5),
        };
        var q = d.Section("axis_ratio");
        var axis = new AxisRatioDistribution
        {
            Mean = q.Double("mean", -5, 5),
            Sigma = q.Double("sigma", 1e-4, 10),
            Min = q.Double("min", 0.2, 1.0),
            Max = q.Double("max", 0.2, 1.0),
        };
        if (axis.Max < axis.Min) throw new InputException($"config key 'deflectors.axis_ratio.max' = {axis.Max} must be ≥ 'deflectors.axis_ratio.min' = {axis.Min}");
        var g = d.Section("shear");
        var shear = new ShearDistribution
        {
            Median = g.Double("median", 0, 0.3),
            SigmaDex = g.Double("sigma_dex", 1e-4, 3),
            Max = g.Double("max", 1e-6, 0.3),
        };
        return new DeflectorPopulation { Vdf = vdf, SigmaMinKms = sMin, SigmaMaxKms = sMax, ZMin = zMin, ZMax = zMax, AxisRatio = axis, Shear = shear };
    }

    static SourcePopulation BindSources(ConfigReader s)
    {
        double zMin = s.Double("z_min", 1e-3, 15), zMax = s.Double("z_max", 1e-3, 15);
        if (zMax <= zMin) throw new InputException($"config key 'sources.z_max' = {zMax} must exceed 'sources.z_min' = {zMin}");
        var types = s.WordList("types", 1, TransientTypes.All.Length, TransientTypes.Names).Select(TransientTypes.Parse).ToArray();

        var ia = s.Section("ia_rate");
        var shape = ia.Choice("shape", "power_law", "delay_time") == "power_law" ? IaRateShape.PowerLaw : IaRateShape.DelayTime;
        var cc = s.Section("cc_rate");
        var fractionsSection = cc.Section("fractions");
        var fractions = new Dictionary<TransientType, double>();
        foreach (var t in TransientTypes.All.Where(TransientTypes.IsCoreCollapse))
            fractions[t] = fractionsSection.Double(TransientTypes.Name(t), 0, 1);
        if (Math.Abs(fractions.Values.Sum() - 1.0) > 1e-6)
            throw new InputException($"config keys 'sources.cc_rate.fractions.*' sum to {fractions.Values.Sum():G6}: expected 1");
        var rates = new RateModel
        {
            IaShape = shape,
            IaRateH70 = ia.Double("rate_h70_per_mpc3_yr", 1e-12, 1, "h70³ yr⁻¹ Mpc⁻³"),
            IaZRef = ia.Double("z_ref", 0, 3),
            IaExponent = ia.Double("exponent", -5, 10),
            IaDtdMinGyr = ia.Double("dtd_min_gyr", 1e-3, 5, "Gyr"),
            IaDtdIndex = ia.Double("dtd_index", -3, 1),
            CcPerSolarMass = cc.Double("per_solar_mass", 0, 1, "M☉⁻¹"),
            CcScale = cc.Double("scale", 0, 100),
            CcFractions = fractions,
        };
        var mags = s.Section("peak_abs_mag_b");
        var peak = new Dictionary<TransientType, PeakMagnitude>();
        foreach (var t in TransientTypes.All)
        {
            var m = mags.Section(TransientTypes.Name(t));
            peak[t] = new PeakMagnitude(m.Double("mean", -25, -10, "mag"), m.Double("sigma", 0, 3, "mag"));
        }
        return new SourcePopulation { ZMin = zMin, ZMax = zMax, Types = types, Rates = rates, PeakMagnitudes = peak };
    }
}
