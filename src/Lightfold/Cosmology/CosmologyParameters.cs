using System.Collections.Immutable;

namespace Lightfold.Cosmology;

/// <summary>Parameters of a Friedmann–Lemaître–Robertson–Walker cosmology with CPL dark energy.</summary>
/// <remarks>
/// Immutable; every value is checked when set, so <c>with</c> copies are valid too.
/// Dark energy follows Chevallier &amp; Polarski 2001 (IJMPD 10, 213) and Linder 2003 (PRL 90, 091301):
/// w(a) = w0 + wa (1 − a). Radiation is off when <see cref="TcmbK"/> is 0 (the default).
/// Ω_Λ (or Ω_DE) is not a parameter: it is 1 − Ωm − Ωk − Ω_radiation.
/// </remarks>
public sealed record CosmologyParameters
{
    /// <summary>Hubble constant H0 [km s⁻¹ Mpc⁻¹], in (0, 1000].</summary>
    public double H0KmSMpc { get; init => field = Check.InRange(value, 1e-3, 1000.0); } = 70.0;

    /// <summary>Matter density Ωm today (cold dark matter and baryons; massive neutrinos are counted apart), in [0, 10].</summary>
    public double OmegaM0 { get; init => field = Check.InRange(value, 0.0, 10.0); } = 0.3;

    /// <summary>Curvature density Ωk today; 0 is flat, &gt; 0 open, &lt; 0 closed. In [−2, 2].</summary>
    public double OmegaK0 { get; init => field = Check.InRange(value, -2.0, 2.0); }

    /// <summary>Dark-energy equation of state today, w0, in [−5, 1].</summary>
    public double W0 { get; init => field = Check.InRange(value, -5.0, 1.0); } = -1.0;

    /// <summary>Dark-energy equation-of-state slope wa (w = w0 + wa (1 − a)), in [−5, 5].</summary>
    public double WA { get; init => field = Check.InRange(value, -5.0, 5.0); }

    /// <summary>CMB temperature today [K]; 0 means no radiation (photons and neutrinos both off).</summary>
    public double TcmbK { get; init => field = Check.InRange(value, 0.0, 100.0); }

    /// <summary>Effective number of neutrino species (used only when <see cref="TcmbK"/> &gt; 0).</summary>
    public double Neff { get; init => field = Check.InRange(value, 0.0, 20.0); } = 3.046;

    /// <summary>Neutrino masses [eV]: empty for massless, else one value per species (floor(Neff) of them).</summary>
    public ImmutableArray<double> NeutrinoMassesEv { get; init; } = [];

    /// <summary>Dimensionless Hubble parameter h = H0 / (100 km s⁻¹ Mpc⁻¹).</summary>
    public double LittleH => H0KmSMpc / 100.0;

    /// <summary>The flat ΛCDM cosmology with H0 = 70, Ωm = 0.3 and no radiation (a common reference choice).</summary>
    public static CosmologyParameters FlatLcdm70 { get; } = new();
}
