namespace Lightfold.Transients;

/// <summary>Types II-L and IIn: the rise-and-decline form of Bazin et al. 2009 (A&amp;A 499, 653) for L_bol, with a cooling blackbody.</summary>
/// <remarks>L(t) ∝ e^(−(t − t₁)/τ_fall) / (1 + e^(−(t − t₁)/τ_rise)) (the functional form of Bazin et al. 2009, from memory),
/// T(t) = T_late + (T_early − T_late) e^(−t/τ_T), R from L = 4πR²σT⁴. Parameters are our documented choices.</remarks>
public sealed class BazinTransient : BlackbodyTransient
{
    /// <summary>Builds the model.</summary>
    public BazinTransient(double riseDays, double fallDays, double onsetDays, double earlyTemperatureK, double lateTemperatureK, double coolingDays, double maxPhaseDays)
    {
        RiseDays = Check.Positive(riseDays);
        FallDays = Check.Positive(fallDays);
        OnsetDays = Check.NonNegative(onsetDays);
        EarlyTemperatureK = Check.Positive(earlyTemperatureK);
        LateTemperatureK = Check.Positive(lateTemperatureK);
        CoolingDays = Check.Positive(coolingDays);
        MaxPhaseDays = Check.Positive(maxPhaseDays);
        Tabulate();
    }

    /// <summary>τ_rise [days].</summary>
    public double RiseDays { get; }
    /// <summary>τ_fall [days].</summary>
    public double FallDays { get; }
    /// <summary>t₁ [days after explosion].</summary>
    public double OnsetDays { get; }
    /// <summary>T at explosion [K].</summary>
    public double EarlyTemperatureK { get; }
    /// <summary>Late-time temperature [K].</summary>
    public double LateTemperatureK { get; }
    /// <summary>τ_T [days].</summary>
    public double CoolingDays { get; }

    /// <inheritdoc/>
    public override double MaxPhaseDays { get; }

    /// <inheritdoc/>
    public override string Description => $"Bazin rise/decline: τ_rise {RiseDays} d, τ_fall {FallDays} d, t₁ {OnsetDays} d; T {EarlyTemperatureK}→{LateTemperatureK} K";

    /// <inheritdoc/>
    protected override double[] BolometricHistory(int n, double step)
    {
        var l = new double[n];
        for (int i = 0; i < n; i++)
        {
            double t = i * step, d = t - OnsetDays;
            // Zero at explosion: subtract the value the form has at t = 0 (tiny when t₁ ≫ τ_rise), floor at 0.
            l[i] = 1e43 * Math.Max(0, Form(d) - Form(-OnsetDays) * Math.Exp(-t / RiseDays));
        }
        return l;
    }

    double Form(double d) => Math.Exp(-d / FallDays) / (1 + Math.Exp(-d / RiseDays));

    /// <inheritdoc/>
    protected override (double, double) Photosphere(double phaseDays, double luminosity)
    {
        double t = LateTemperatureK + (EarlyTemperatureK - LateTemperatureK) * Math.Exp(-phaseDays / CoolingDays);
        return (t, RadiusFor(luminosity, t));
    }
}
