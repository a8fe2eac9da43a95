namespace Lightfold.Transients;

/// <summary>A transient's rest-frame spectral time series and photospheric radius.</summary>
/// <remarks>Phases are rest-frame days since explosion. The overall scale is arbitrary: every event is rescaled to its
/// drawn peak absolute magnitude, keeping the model's shape. Implementations are immutable.</remarks>
public interface ITransientModel
{
    /// <summary>One line naming the model and its parameters.</summary>
    string Description { get; }

    /// <summary>Phase after which the model is not evaluated (flux taken as zero) [rest-frame days].</summary>
    double MaxPhaseDays { get; }

    /// <summary>Spectral luminosity density L_λ [erg s⁻¹ Å⁻¹] at rest wavelength λ [Å] and phase t.</summary>
    double SpectralLuminosity(double phaseDays, double wavelengthAngstrom);

    /// <summary>Photospheric radius [cm] (for microlensing of a finite source).</summary>
    double PhotosphereRadiusCm(double phaseDays);

    /// <summary>For blackbody-based models, the photospheric temperature and radius (fast photometry); false otherwise.</summary>
    bool TryBlackbody(double phaseDays, out double temperatureK, out double radiusCm);
}

/// <summary>Empirical suppression of the ultraviolet by line blanketing: S(λ) = (λ/λ_c)^p below λ_c, 1 above.</summary>
/// <remarks>Iron-group line blanketing removes most ultraviolet flux of supernovae (common practice); λ_c = 4000 Å and
/// p = 3 are our documented empirical choice, not a fit.</remarks>
public sealed record UvSuppression(double CutoffAngstrom = 4000, double Slope = 3)
{
    /// <summary>S(λ).</summary>
    public double Factor(double wavelengthAngstrom)
        => wavelengthAngstrom >= CutoffAngstrom ? 1.0 : Math.Pow(wavelengthAngstrom / CutoffAngstrom, Slope);
}
