namespace Lightfold.Tests.Support;

/// <summary>Assertions on relative and absolute closeness, with the values in the failure message.</summary>
public static class AssertRelative
{
    /// <summary>|actual − expected| ≤ relTol |expected| (or ≤ relTol when expected is 0).</summary>
    public static void Equal(double expected, double actual, double relTol, string? what = null)
    {
        double scale = expected == 0 ? 1.0 : Math.Abs(expected);
        double rel = Math.Abs(actual - expected) / scale;
        Assert.True(rel <= relTol && !double.IsNaN(actual),
            $"{what ?? "value"}: expected {expected:R}, got {actual:R} (relative error {rel:E3} > {relTol:E1})");
    }

    /// <summary>|actual − expected| ≤ absTol.</summary>
    public static void Near(double expected, double actual, double absTol, string? what = null)
        => Assert.True(Math.Abs(actual - expected) <= absTol && !double.IsNaN(actual),
            $"{what ?? "value"}: expected {expected:R} ± {absTol:E2}, got {actual:R} (off by {Math.Abs(actual - expected):E3})");
}
