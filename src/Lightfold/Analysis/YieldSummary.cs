namespace Lightfold.Analysis;

/// <summary>Counts per year in the footprint from a catalog's rows: weighted sums (oversample) or plain counts
/// (realization, weight 1), with the Poisson uncertainty of a survey that expects that many events.</summary>
/// <param name="Rows">Catalog rows in the group.</param>
/// <param name="ExpectedTotal">Σ weight over the explosion window.</param>
/// <param name="PerYear">Σ weight / explosion years.</param>
/// <param name="PoissonPerYear">√(Σ weight) / years: the scatter of a real survey's count (for realization catalogs, √N).</param>
/// <param name="SamplingPerYear">√(Σ weight²) / years: the Monte Carlo error of this catalog's estimate (0 for weight-1 rows is not implied: for a realization it equals the Poisson term).</param>
public sealed record YieldCount(long Rows, double ExpectedTotal, double PerYear, double PoissonPerYear, double SamplingPerYear)
{
    /// <summary>Sums weights into a count.</summary>
    public static YieldCount Of(IEnumerable<double> weights, double years)
    {
        long n = 0;
        double sum = 0, sum2 = 0;
        foreach (double w in weights) { n++; sum += w; sum2 += w * w; }
        return new YieldCount(n, sum, sum / years, Math.Sqrt(sum) / years, Math.Sqrt(sum2) / years);
    }
}
