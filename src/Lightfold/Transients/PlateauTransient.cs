namespace Lightfold.Transients;

/// <summary>Type II-P: the analytic plateau of Popov 1993 (ApJ 414, 712) followed by the radioactive tail.</summary>
/// <remarks>
/// Plateau length t_p = 99 d κ₀.₃₄^(1/6) M₁₀^(1/2) R₅₀₀^(1/6) E₅₁^(−1/6) and luminosity
/// L_p = 1.64e42 erg/s R₅₀₀^(2/3) E₅₁^(5/6) M₁₀^(−1/2) κ₀.₃₄^(−1/3) (Popov 1993; prefactors from memory).
/// Shape (our documented parameterisation): L rises as L_p(1 − e^(−t/2 d)), leaves the plateau through a logistic
/// drop of 5 d width at t_p, then follows ⁵⁶Co deposition of M_Ni. Temperature cools from T_early toward the
/// hydrogen recombination temperature with an e-folding time, R follows from L = 4πR²σT⁴.
/// </remarks>
public sealed class PlateauTransient : BlackbodyTransient
{
    /// <summary>Builds the model.</summary>
    public PlateauTransient(double energy51, double ejectaMassSolar, double radiusSolar, double opacityCm2PerG, double nickelMassSolar,
        double recombinationTemperatureK, double earlyTemperatureK, double coolingDays, double maxPhaseDays)
    {
        Energy51 = Check.Positive(energy51);
        EjectaMassSolar = Check.Positive(ejectaMassSolar);
        RadiusSolar = Check.Positive(radiusSolar);
        OpacityCm2PerG = Check.Positive(opacityCm2PerG);
        NickelMassSolar = Check.NonNegative(nickelMassSolar);
        RecombinationTemperatureK = Check.Positive(recombinationTemperatureK);
        EarlyTemperatureK = Check.Positive(earlyTemperatureK);
        CoolingDays = Check.Positive(coolingDays);
        MaxPhaseDays = Check.Positive(maxPhaseDays);
        double k = opacityCm2PerG / 0.34, m = ejectaMassSolar / 10, r = radiusSolar / 500;
        PlateauDays = 99 * Math.Pow(k, 1.0 / 6) * Math.Sqrt(m) * Math.Pow(r, 1.0 / 6) * Math.Pow(energy51, -1.0 / 6);
        PlateauLuminosity = 1.64e42 * Math.Pow(r, 2.0 / 3) * Math.Pow(energy51, 5.0 / 6) / Math.Sqrt(m) * Math.Pow(k, -1.0 / 3);
        Tabulate();
    }

    /// <summary>E [10⁵¹ erg].</summary>
    public double Energy51 { get; }
    /// <summary>M_ej [M☉].</summary>
    public double EjectaMassSolar { get; }
    /// <summary>Progenitor radius [R☉].</summary>
    public double RadiusSolar { get; }
    /// <summary>κ [cm²/g].</summary>
    public double OpacityCm2PerG { get; }
    /// <summary>M_Ni [M☉].</summary>
    public double NickelMassSolar { get; }
    /// <summary>Recombination temperature [K].</summary>
    public double RecombinationTemperatureK { get; }
    /// <summary>Initial temperature [K].</summary>
    public double EarlyTemperatureK { get; }
    /// <summary>Cooling e-folding time [days].</summary>
    public double CoolingDays { get; }
    /// <summary>Popov plateau length [days].</summary>
    public double PlateauDays { get; }
    /// <summary>Popov plateau luminosity [erg/s].</summary>
    public double PlateauLuminosity { get; }

    /// <inheritdoc/>
    public override double MaxPhaseDays { get; }

    /// <inheritdoc/>
    public override string Description
        => $"Popov plateau: E {Energy51}e51 erg, M_ej {EjectaMassSolar} M☉, R {RadiusSolar} R☉ → t_p {PlateauDays:F0} d, L_p {PlateauLuminosity:E2} erg/s; tail M_Ni {NickelMassSolar} M☉";

    /// <inheritdoc/>
    protected override double[] BolometricHistory(int n, double step)
    {
        var l = new double[n];
        for (int i = 0; i < n; i++)
        {
            double t = i * step;
            double plateau = PlateauLuminosity * (1 - Math.Exp(-t / 2.0));
            double s = 1 / (1 + Math.Exp((t - PlateauDays) / 5.0));
            l[i] = s * plateau + (1 - s) * RadioactiveDecay.DepositionErgPerS(NickelMassSolar, t);
        }
        return l;
    }

    /// <inheritdoc/>
    protected override (double, double) Photosphere(double phaseDays, double luminosity)
    {
        double t = RecombinationTemperatureK + (EarlyTemperatureK - RecombinationTemperatureK) * Math.Exp(-phaseDays / CoolingDays);
        return (t, RadiusFor(luminosity, t));
    }
}
