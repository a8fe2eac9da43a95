namespace Lightfold.Transients;

/// <summary>Radioactively powered light curve with photon diffusion (Arnett 1982, ApJ 253, 785): SNe Ia, Ib, Ic.</summary>
/// <remarks>
/// Arnett's solution obeys dL/dt = (2t/τ_m²)(L_dep(t) − L), with diffusion time τ_m = √(2κM_ej/(βcv)), β = 13.8
/// (Arnett 1982; form as restated by Chatzopoulos et al. 2012, ApJ 746, 121, from memory). It is integrated here with
/// RK4 from L(0) = 0. At the peak dL/dt = 0, so L_peak = L_dep(t_peak): Arnett's rule holds exactly for this model.
/// The photosphere expands at the ejecta velocity until the temperature floor is reached.
/// </remarks>
public sealed class ArnettTransient : BlackbodyTransient
{
    /// <summary>Builds the model.</summary>
    /// <param name="ejectaMassSolar">M_ej [M☉].</param>
    /// <param name="nickelMassSolar">M_Ni [M☉].</param>
    /// <param name="velocityKms">Ejecta (photospheric) velocity [km/s].</param>
    /// <param name="opacityCm2PerG">Grey optical opacity κ [cm² g⁻¹].</param>
    /// <param name="temperatureFloorK">Photospheric temperature floor [K].</param>
    /// <param name="maxPhaseDays">Last phase evaluated [days].</param>
    public ArnettTransient(double ejectaMassSolar, double nickelMassSolar, double velocityKms, double opacityCm2PerG, double temperatureFloorK, double maxPhaseDays)
    {
        EjectaMassSolar = Check.Positive(ejectaMassSolar);
        NickelMassSolar = Check.Positive(nickelMassSolar);
        VelocityKms = Check.Positive(velocityKms);
        OpacityCm2PerG = Check.Positive(opacityCm2PerG);
        TemperatureFloorK = Check.Positive(temperatureFloorK);
        MaxPhaseDays = Check.Positive(maxPhaseDays);
        double tauM = Math.Sqrt(2 * opacityCm2PerG * ejectaMassSolar * Units.SolarMassG / (13.8 * Units.SpeedOfLightCms * velocityKms * 1e5));
        DiffusionTimeDays = tauM / Units.SecondsPerDay;
        Tabulate();
    }

    /// <summary>M_ej [M☉].</summary>
    public double EjectaMassSolar { get; }
    /// <summary>M_Ni [M☉].</summary>
    public double NickelMassSolar { get; }
    /// <summary>v [km/s].</summary>
    public double VelocityKms { get; }
    /// <summary>κ [cm²/g].</summary>
    public double OpacityCm2PerG { get; }
    /// <summary>Temperature floor [K].</summary>
    public double TemperatureFloorK { get; }
    /// <summary>τ_m [days].</summary>
    public double DiffusionTimeDays { get; }

    /// <inheritdoc/>
    public override double MaxPhaseDays { get; }

    /// <inheritdoc/>
    public override string Description
        => $"Arnett diffusion: M_ej {EjectaMassSolar} M☉, M_Ni {NickelMassSolar} M☉, v {VelocityKms} km/s, κ {OpacityCm2PerG} cm²/g (τ_m {DiffusionTimeDays:F1} d)";

    /// <inheritdoc/>
    protected override double[] BolometricHistory(int n, double step)
    {
        var l = new double[n];
        double tm2 = DiffusionTimeDays * DiffusionTimeDays;
        double F(double t, double y) => 2 * t / tm2 * (RadioactiveDecay.DepositionErgPerS(NickelMassSolar, t) - y);
        const int sub = 10;
        double h = step / sub, y0 = 0;
        for (int i = 1; i < n; i++)
        {
            for (int k = 0; k < sub; k++)
            {
                double t = (i - 1) * step + k * h;
                double k1 = F(t, y0), k2 = F(t + h / 2, y0 + h / 2 * k1), k3 = F(t + h / 2, y0 + h / 2 * k2), k4 = F(t + h, y0 + h * k3);
                y0 += h / 6 * (k1 + 2 * k2 + 2 * k3 + k4);
            }
            l[i] = y0;
        }
        return l;
    }

    /// <inheritdoc/>
    protected override (double, double) Photosphere(double phaseDays, double luminosity)
        => ExpandingWithFloor(phaseDays, luminosity, VelocityKms, TemperatureFloorK);
}
