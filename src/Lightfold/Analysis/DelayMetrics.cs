namespace Lightfold.Analysis;

/// <summary>One scored pair: truth, estimate (NaN if not submitted) and its error.</summary>
public readonly record struct ScoredPair(long SystemId, int ImageA, int ImageB, double TrueDelayDays, double EstimatedDays, double ErrorDays)
{
    /// <summary>Whether the estimator reported a delay for this pair.</summary>
    public bool Submitted => double.IsFinite(EstimatedDays) && ErrorDays > 0;
}

/// <summary>The Time Delay Challenge metrics of Liao et al. 2015 (ApJ 800, 11), defined by Dobler et al. 2015 (ApJ 799, 168).</summary>
/// <param name="Total">N: pairs that should have been estimated.</param>
/// <param name="Submitted">fN: pairs with an estimate.</param>
/// <param name="SuccessFraction">f = N_submitted / N.</param>
/// <param name="ChiSquare">χ² = (1/fN) Σ ((Δt̃ − Δt)/δ)².</param>
/// <param name="Precision">P = (1/fN) Σ δ/|Δt|.</param>
/// <param name="Accuracy">A = (1/fN) Σ (Δt̃ − Δt)/Δt.</param>
/// <remarks>Metric definitions as recalled (from memory; the names and their roles are confirmed in Liao et al. 2015).</remarks>
public sealed record DelayMetrics(int Total, int Submitted, double SuccessFraction, double ChiSquare, double Precision, double Accuracy)
{
    /// <summary>Computes the metrics over <paramref name="pairs"/>.</summary>
    public static DelayMetrics Of(IReadOnlyCollection<ScoredPair> pairs)
    {
        int total = pairs.Count;
        var s = pairs.Where(p => p.Submitted).ToList();
        if (s.Count == 0) return new(total, 0, 0, double.NaN, double.NaN, double.NaN);
        double chi2 = s.Average(p => Math.Pow((p.EstimatedDays - p.TrueDelayDays) / p.ErrorDays, 2));
        double precision = s.Average(p => p.ErrorDays / Math.Abs(p.TrueDelayDays));
        double accuracy = s.Average(p => (p.EstimatedDays - p.TrueDelayDays) / p.TrueDelayDays);
        return new(total, s.Count, (double)s.Count / total, chi2, precision, accuracy);
    }
}
