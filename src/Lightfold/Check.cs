using System.Runtime.CompilerServices;

namespace Lightfold;

/// <summary>Argument checks used in <c>init</c> accessors, so that <c>with</c> copies stay valid.</summary>
public static class Check
{
    /// <summary>Returns <paramref name="value"/> if finite, else throws naming the parameter.</summary>
    public static double Finite(double value, [CallerArgumentExpression(nameof(value))] string? name = null)
        => double.IsFinite(value) ? value : throw new ArgumentOutOfRangeException(name, value, "must be a finite number");

    /// <summary>Returns <paramref name="value"/> if finite and &gt; 0.</summary>
    public static double Positive(double value, [CallerArgumentExpression(nameof(value))] string? name = null)
        => double.IsFinite(value) && value > 0 ? value : throw new ArgumentOutOfRangeException(name, value, "must be a finite number > 0");

    /// <summary>Returns <paramref name="value"/> if finite and ≥ 0.</summary>
    public static double NonNegative(double value, [CallerArgumentExpression(nameof(value))] string? name = null)
        => double.IsFinite(value) && value >= 0 ? value : throw new ArgumentOutOfRangeException(name, value, "must be a finite number ≥ 0");

    /// <summary>Returns <paramref name="value"/> if in the closed range [min, max].</summary>
    public static double InRange(double value, double min, double max, [CallerArgumentExpression(nameof(value))] string? name = null)
        => value >= min && value <= max ? value : throw new ArgumentOutOfRangeException(name, value, $"must lie in [{min}, {max}]");
}
