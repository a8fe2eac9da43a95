using Lightfold.Randomness;

namespace Lightfold.Microlensing;

/// <summary>Stellar initial mass function on [min, max] M☉: Salpeter 1955 or Kroupa 2001.</summary>
/// <remarks>Salpeter 1955 (ApJ 121, 161): dN/dm ∝ m^−2.35. Kroupa 2001 (MNRAS 322, 231): dN/dm ∝ m^−1.3 below 0.5 M☉
/// and m^−2.3 above (the 0.08 M☉ break is below the usual lower limit; from memory). Immutable.</remarks>
public sealed record InitialMassFunction
{
    /// <summary>"salpeter" or "kroupa".</summary>
    public string Kind { get; init; } = "salpeter";
    /// <summary>Lowest mass [M☉].</summary>
    public double MinMassSolar { get; init => field = Check.Positive(value); } = 0.1;
    /// <summary>Highest mass [M☉].</summary>
    public double MaxMassSolar { get; init => field = Check.Positive(value); } = 1.0;

    const double Break = 0.5, LowSlope = -1.3, HighSlope = -2.3, SalpeterSlope = -2.35;

    /// <summary>Draws one mass [M☉].</summary>
    public double Sample(ref KeyedRandom rng)
    {
        if (Kind == "salpeter" || MaxMassSolar <= Break || MinMassSolar >= Break)
        {
            double slope = Kind == "salpeter" ? SalpeterSlope : (MaxMassSolar <= Break ? LowSlope : HighSlope);
            return rng.PowerLaw(slope, MinMassSolar, MaxMassSolar);
        }
        // Kroupa across the break: choose the segment by its share of the number, continuous at the break.
        double lo = Segment(LowSlope, MinMassSolar, Break, 1.0);
        double hi = Segment(HighSlope, Break, MaxMassSolar, Math.Pow(Break, LowSlope - HighSlope));
        return rng.NextDouble() * (lo + hi) < lo ? rng.PowerLaw(LowSlope, MinMassSolar, Break) : rng.PowerLaw(HighSlope, Break, MaxMassSolar);
    }

    static double Segment(double slope, double a, double b, double norm)
        => norm * (Math.Abs(slope + 1) < 1e-12 ? Math.Log(b / a) : (Math.Pow(b, slope + 1) - Math.Pow(a, slope + 1)) / (slope + 1));

    /// <summary>Mean mass ⟨m⟩ [M☉].</summary>
    public double MeanMassSolar
    {
        get
        {
            double Moment(double slope, double a, double b, double norm, int k)
                => Segment(slope + k, a, b, norm);
            if (Kind == "salpeter" || MaxMassSolar <= Break || MinMassSolar >= Break)
            {
                double s = Kind == "salpeter" ? SalpeterSlope : (MaxMassSolar <= Break ? LowSlope : HighSlope);
                return Moment(s, MinMassSolar, MaxMassSolar, 1, 1) / Moment(s, MinMassSolar, MaxMassSolar, 1, 0);
            }
            double n2 = Math.Pow(Break, LowSlope - HighSlope);
            return (Moment(LowSlope, MinMassSolar, Break, 1, 1) + Moment(HighSlope, Break, MaxMassSolar, n2, 1))
                   / (Moment(LowSlope, MinMassSolar, Break, 1, 0) + Moment(HighSlope, Break, MaxMassSolar, n2, 0));
        }
    }
}
