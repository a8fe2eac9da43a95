using Lightfold.Cosmology;
using Lightfold.Populations;
using Lightfold.Survey;
using Lightfold.Transients;

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
        string mode = run.Choice("mode", "oversample", "realization", "training");
        var training = r.Section("training");
        var trainingSettings = new TrainingSettings
        {
            LensedFraction = training.Double("lensed_fraction", 0, 1),
            TrainFraction = training.Double("train_fraction", 0, 1),
            ValidationFraction = training.Double("validation_fraction", 0, 1),
        };
        if (trainingSettings.TrainFraction + trainingSettings.ValidationFraction > 1 + 1e-12)
            throw new InputException($"config keys 'training.train_fraction' + 'training.validation_fraction' = {trainingSettings.TrainFraction + trainingSettings.ValidationFraction}: must not exceed 1 (the rest is the test split)");
        var settings = new RunSettings
        {
            Mode = mode switch { "oversample" => RunMode.Oversample, "realization" => RunMode.Realization, _ => RunMode.Training },
            Count = run.Long("count", 1, 10_000_000_000),
            BatchSize = run.Int("batch_size", 1, 4_000_000),
            Training = trainingSettings,
        };
        var cosmology = BindCosmology(r.Section("cosmology"));
        var survey = BindSurvey(r.Section("survey"));
        var sources = BindSources(r.Section("sources"));
        var deflectors = BindDeflectors(r.Section("deflectors"));
        var observing = BindObserving(r, survey);
        if (settings.Mode == RunMode.Training && !observing.LightCurves)
            throw new InputException("config key 'run.mode' = 'training' needs light curves ('light_curves.enabled' = true): the features come from the photometry");
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
            Observing = observing,
            Microlensing = BindMicrolensing(r.Section("microlensing")),
        };
    }

    static Microlensing.MicrolensingSettings BindMicrolensing(ConfigReader m)
    {
        bool enabled = m.Bool("enabled");
        var stellar = new Microlensing.StellarConvergence
        {
            Model = m.Choice("stellar_model", "de_vaucouleurs", "constant"),
            ConstantFraction = m.Double("constant_fraction", 0, 1),
            FractionAtEinsteinRadius = m.Double("fraction_at_einstein_radius", 0, 1),
            EffectiveRadiusKpcAt200Kms = m.Double("effective_radius_kpc_at_200kms", 0.01, 100, "kpc"),
            EffectiveRadiusSlope = m.Double("effective_radius_slope", -5, 5),
        };
        var imf = m.Section("imf");
        var massFunction = new Microlensing.InitialMassFunction
        {
            Kind = imf.Choice("kind", "salpeter", "kroupa"),
            MinMassSolar = imf.Double("mass_min_msun", 0.01, 100, "M☉"),
            MaxMassSolar = imf.Double("mass_max_msun", 0.01, 100, "M☉"),
        };
        if (massFunction.MaxMassSolar <= massFunction.MinMassSolar)
            throw new InputException($"config key 'microlensing.imf.mass_max_msun' = {massFunction.MaxMassSolar} must exceed 'microlensing.imf.mass_min_msun' = {massFunction.MinMassSolar}");
        var map = m.Section("map");
        var grid = m.Section("grid");
        var bank = new Microlensing.MapBankSettings
        {
            SizeEinsteinRadii = map.Double("size_einstein_radii", 0.1, 1000, "R_E"),
            Pixels = map.Int("pixels", 16, 10_000),
            RaysPerPixel = map.Double("rays_per_pixel", 1, 100_000),
            MarginEinsteinRadii = map.Double("margin_einstein_radii", 0, 100, "R_E"),
            Seed = map.UInt64("seed"),
            KappaStep = grid.Double("kappa_step", 0.005, 1),
            GammaStep = grid.Double("gamma_step", 0.005, 1),
            StarFractions = grid.DoubleList("star_fractions", 1e-3, 1, 1, 50),
            Imf = massFunction,
        };
        return new Microlensing.MicrolensingSettings
        {
            Enabled = enabled, Stellar = stellar, Bank = bank,
            LimbDarkening = m.Double("limb_darkening", 0, 1),
            AchromaticDays = m.Double("achromatic_days", 0, 1000, "days"),
            ChromaticIndex = m.Double("chromatic_index", 0, 5),
            ReferenceWavelengthAngstrom = m.Double("reference_wavelength_angstrom", 100, 100_000, "Å"),
        };
    }

    static ObservingSettings BindObserving(ConfigReader r, SurveyWindow survey)
    {
        var lc = r.Section("light_curves");
        bool enabled = lc.Bool("enabled");
        double pre = lc.Double("pre_explosion_days", 0, 1000, "days");

        var t = r.Section("transients");
        var uv = new UvSuppression(t.Double("uv_cutoff_angstrom", 100, 20000, "Å"), t.Double("uv_slope", 0, 20));
        var models = new Dictionary<TransientType, TransientSpec>();
        foreach (var type in TransientTypes.All)
        {
            var m = t.Section(TransientTypes.Name(type));
            TransientSpec spec = type switch
            {
                TransientType.Ia or TransientType.Ib or TransientType.Ic => new ArnettSpec(
                    m.Double("ejecta_mass_msun", 0.01, 100, "M☉"), m.Double("nickel_mass_msun", 1e-4, 10, "M☉"),
                    m.Double("velocity_kms", 100, 100_000, "km/s"), m.Double("opacity_cm2_g", 1e-3, 10, "cm²/g"),
                    m.Double("temperature_floor_k", 500, 50_000, "K")),
                TransientType.IIP => new PlateauSpec(
                    m.Double("energy_1e51_erg", 0.01, 100, "10⁵¹ erg"), m.Double("ejecta_mass_msun", 0.1, 100, "M☉"),
                    m.Double("progenitor_radius_rsun", 1, 5000, "R☉"), m.Double("opacity_cm2_g", 1e-3, 10, "cm²/g"),
                    m.Double("nickel_mass_msun", 0, 10, "M☉"), m.Double("recombination_temperature_k", 1000, 20_000, "K"),
                    m.Double("early_temperature_k", 1000, 100_000, "K"), m.Double("cooling_days", 0.1, 1000, "days")),
                _ => new BazinSpec(
                    m.Double("rise_days", 0.1, 1000, "days"), m.Double("fall_days", 0.1, 5000, "days"), m.Double("onset_days", 0, 1000, "days"),
                    m.Double("early_temperature_k", 1000, 100_000, "K"), m.Double("late_temperature_k", 1000, 100_000, "K"),
                    m.Double("cooling_days", 0.1, 1000, "days")),
            };
            models[type] = spec with
            {
                MaxPhaseDays = m.Double("max_phase_days", 1, 3000, "days"),
                TemplatePath = m.Text("template", 1000),
                TemplateVelocityKms = m.Double("template_velocity_kms", 100, 100_000, "km/s"),
            };
        }

        var p = r.Section("photometry");
        string[] bands = p.WordList("bands", 1, 20);
        var files = new Dictionary<string, string>(StringComparer.Ordinal);
        var filesSection = p.Section("bandpass_files");
        foreach (string name in p.ChildNames("bandpass_files"))
            files[name] = filesSection.Text(name, 1000);
        foreach (string band in bands)
            if (!files.ContainsKey(band) && !Photometry.BuiltInBands.TryGet(band, out _))
                throw new InputException($"config key 'photometry.bands' names '{band}', which is neither a built-in band ({string.Join(", ", Photometry.BuiltInBands.Names)}) nor in 'photometry.bandpass_files'");
        var dust = p.Section("dust");
        double hostEbv = dust.Double("host_ebv_mean", 0, 5, "mag"), mwEbv = dust.Double("mw_ebv", 0, 5, "mag"), rV = dust.Double("r_v", 1, 10);

        var s = r.Section("survey");
        string visitTable = s.Text("visit_table", 1000);
        double blend = s.Double("blend_fraction_of_seeing", 0, 10);
        var c = s.Section("cadence");
        double season = c.Double("season_days", 1, 365.25, "days"), weather = c.Double("weather_loss", 0, 0.99), jitter = c.Double("jitter_days", 0, 10, "days");
        // Every band's cadence is read and checked (so unused bands in a lower layer are not "unknown keys");
        // the bands in photometry.bands must each have one.
        var cb = c.Section("bands");
        var perBand = new Dictionary<string, BandCadence>(StringComparer.Ordinal);
        foreach (string band in c.ChildNames("bands").Union(bands))
        {
            var b = cb.Section(band);
            perBand[band] = new BandCadence(band, b.Double("revisit_days", 0.01, 1000, "days"), b.Double("depth_5sigma_mag", 10, 35, "mag"),
                b.Double("depth_sigma_mag", 0, 3, "mag"), b.Double("seeing_median_arcsec", 0.01, 20, "arcsec"), b.Double("seeing_sigma_dex", 0, 2, "dex"));
        }
        var cadence = bands.Select(b => perBand[b]).ToList();

        var n = r.Section("noise");
        var noise = new NoiseModel { SourceFractionAtDepth = n.Double("source_fraction_at_depth", 0, 0.9), FloorMag = n.Double("systematic_floor_mag", 0, 0.1, "mag") };
        var d = r.Section("detection");
        var detection = new DetectionRule
        {
            MinSnr = d.Double("min_snr", 0, 1000),
            MinDetections = d.Int("min_detections", 1, 10_000),
            MinBands = d.Int("min_bands", 1, bands.Length),
            WindowDays = d.Double("window_days", 0.01, 100_000, "days"),
            RequireBrighterThanCandle = d.Bool("require_brighter_than_candle"),
            CandleSigmas = d.Double("candle_sigmas", 0, 10),
        };
        return new ObservingSettings
        {
            LightCurves = enabled, PreExplosionDays = pre, Models = models, Uv = uv, Bands = bands, BandpassFiles = files,
            HostEbvMean = hostEbv, MilkyWayEbv = mwEbv, RV = rV, Cadence = cadence, SeasonDays = season, WeatherLoss = weather,
            JitterDays = jitter, VisitTablePath = visitTable, BlendFractionOfSeeing = blend, Noise = noise, Detection = detection,
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
