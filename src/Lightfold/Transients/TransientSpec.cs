namespace Lightfold.Transients;

/// <summary>Parameters of one type's light-curve model, as configured; <see cref="Build"/> makes the model.</summary>
public abstract record TransientSpec
{
    /// <summary>Last phase evaluated [rest-frame days].</summary>
    public double MaxPhaseDays { get; init => field = Check.Positive(value); } = 300;
    /// <summary>A user spectral time-series table replacing the built-in model ("" = built-in).</summary>
    public string TemplatePath { get; init; } = "";
    /// <summary>Photospheric velocity used for a template's radius [km/s].</summary>
    public double TemplateVelocityKms { get; init => field = Check.Positive(value); } = 10_000;
    /// <summary>Builds the built-in model (templates are loaded by the catalog layer, which reads files).</summary>
    public abstract ITransientModel Build(UvSuppression uv);
}

/// <summary>Arnett 1982 radioactive diffusion model (SNe Ia, Ib, Ic).</summary>
public sealed record ArnettSpec(double EjectaMassSolar, double NickelMassSolar, double VelocityKms, double OpacityCm2PerG, double TemperatureFloorK) : TransientSpec
{
    /// <inheritdoc/>
    public override ITransientModel Build(UvSuppression uv)
        => new ArnettTransient(EjectaMassSolar, NickelMassSolar, VelocityKms, OpacityCm2PerG, TemperatureFloorK, MaxPhaseDays) { Uv = uv };
}

/// <summary>Popov 1993 plateau model (SNe IIP).</summary>
public sealed record PlateauSpec(double Energy51, double EjectaMassSolar, double RadiusSolar, double OpacityCm2PerG, double NickelMassSolar,
    double RecombinationTemperatureK, double EarlyTemperatureK, double CoolingDays) : TransientSpec
{
    /// <inheritdoc/>
    public override ITransientModel Build(UvSuppression uv)
        => new PlateauTransient(Energy51, EjectaMassSolar, RadiusSolar, OpacityCm2PerG, NickelMassSolar, RecombinationTemperatureK, EarlyTemperatureK, CoolingDays, MaxPhaseDays) { Uv = uv };
}

/// <summary>Bazin et al. 2009 rise/decline model (SNe IIL, IIn).</summary>
public sealed record BazinSpec(double RiseDays, double FallDays, double OnsetDays, double EarlyTemperatureK, double LateTemperatureK, double CoolingDays) : TransientSpec
{
    /// <inheritdoc/>
    public override ITransientModel Build(UvSuppression uv)
        => new BazinTransient(RiseDays, FallDays, OnsetDays, EarlyTemperatureK, LateTemperatureK, CoolingDays, MaxPhaseDays) { Uv = uv };
}
