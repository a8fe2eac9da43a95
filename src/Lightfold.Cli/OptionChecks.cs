using System.Globalization;

namespace Lightfold.Cli;

/// <summary>Range checks of numeric command-line options: one message naming the option, the value and the range.</summary>
public static class OptionChecks
{
    /// <summary>v in [min, max].</summary>
    public static double InRange(double v, string option, double min, double max)
        => double.IsFinite(v) && v >= min && v <= max ? v : throw new InputException($"{option} {Show(v)}: expected a value in [{Show(min)}, {Show(max)}]");

    /// <summary>v in (min, max].</summary>
    public static double Above(double v, string option, double min, double max = double.PositiveInfinity)
        => double.IsFinite(v) && v > min && v <= max ? v : throw new InputException($"{option} {Show(v)}: expected a value in ({Show(min)}, {Show(max)}]");

    static string Show(double v) => double.IsPositiveInfinity(v) ? "∞" : v.ToString("G", CultureInfo.InvariantCulture);
}
