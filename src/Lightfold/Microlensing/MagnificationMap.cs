namespace Lightfold.Microlensing;

/// <summary>What a magnification map is: macro parameters, star field and sampling.</summary>
/// <remarks>Lengths in Einstein radii R_E of a 1 M☉ star on the source plane (θ_E for image-plane angles). The map's x
/// axis is the shear direction. Immutable; <see cref="CacheKey"/> names every input that changes the map.</remarks>
public sealed record MapSpec
{
    /// <summary>Total convergence κ at the image.</summary>
    public required double Kappa { get; init => field = Check.InRange(value, 0, 10); }
    /// <summary>Shear γ at the image.</summary>
    public required double Gamma { get; init => field = Check.InRange(value, 0, 10); }
    /// <summary>Convergence in stars κ_* (≤ κ).</summary>
    public required double KappaStar { get; init => field = Check.InRange(value, 0, 10); }
    /// <summary>Side of the map [R_E].</summary>
    public double SizeEinsteinRadii { get; init => field = Check.Positive(value); } = 10;
    /// <summary>Pixels per side.</summary>
    public int Pixels { get; init; } = 500;
    /// <summary>Mean rays per map pixel.</summary>
    public double RaysPerPixel { get; init => field = Check.Positive(value); } = 100;
    /// <summary>Initial mass function of the stars.</summary>
    public InitialMassFunction Imf { get; init; } = new();
    /// <summary>Seed of the star field.</summary>
    public ulong Seed { get; init; } = 1;
    /// <summary>Extra source-plane border shot around the map, so rays deflected into it from outside are counted [R_E].</summary>
    public double MarginEinsteinRadii { get; init => field = Check.NonNegative(value); } = 2;

    /// <summary>Macro magnification 1/((1 − κ)² − γ²) (signed).</summary>
    public double MacroMagnification => 1 / ((1 - Kappa) * (1 - Kappa) - Gamma * Gamma);

    /// <summary>A string naming every input (for caches and FITS keywords).</summary>
    public string CacheKey => FormattableString.Invariant(
        $"v1-k{Kappa:R}-g{Gamma:R}-ks{KappaStar:R}-{Imf.Kind}{Imf.MinMassSolar:R}-{Imf.MaxMassSolar:R}-L{SizeEinsteinRadii:R}-n{Pixels}-r{RaysPerPixel:R}-m{MarginEinsteinRadii:R}-s{Seed}");
}

/// <summary>A magnification map: μ per source-plane pixel (row-major, y outer), from inverse ray shooting.</summary>
public sealed class MagnificationMap
{
    /// <summary>Wraps computed values.</summary>
    public MagnificationMap(MapSpec spec, float[] magnification, int stars, long rays)
    {
        Spec = spec;
        Magnification = magnification;
        Stars = stars;
        Rays = rays;
    }

    /// <summary>Inputs.</summary>
    public MapSpec Spec { get; }
    /// <summary>μ per pixel (absolute; the macro value is the expected mean).</summary>
    public float[] Magnification { get; }
    /// <summary>Stars in the field.</summary>
    public int Stars { get; }
    /// <summary>Rays shot.</summary>
    public long Rays { get; }

    /// <summary>Ray–star pairs summed directly (the near field), for cost accounting.</summary>
    public long NearInteractions { get; init; }
    /// <summary>Pixels per side.</summary>
    public int Pixels => Spec.Pixels;
    /// <summary>Pixel size [R_E].</summary>
    public double PixelEinsteinRadii => Spec.SizeEinsteinRadii / Spec.Pixels;

    double? mean;

    /// <summary>Mean μ over the map (computed once).</summary>
    public double Mean() => mean ??= Magnification.Average(v => (double)v);

    /// <summary>Quantile q of μ over the pixels.</summary>
    public double Quantile(double q)
    {
        var sorted = (float[])Magnification.Clone();
        Array.Sort(sorted);
        double pos = q * (sorted.Length - 1);
        int i = (int)pos;
        return i + 1 < sorted.Length ? sorted[i] + (pos - i) * (sorted[i + 1] - sorted[i]) : sorted[i];
    }
}
