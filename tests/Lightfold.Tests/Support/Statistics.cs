namespace Lightfold.Tests.Support;

/// <summary>Small statistical tools for sampler checks.</summary>
public static class Statistics
{
    /// <summary>
    /// Kolmogorov–Smirnov statistic D = sup |F_n(x) − F(x)| of a sample against a CDF.
    /// </summary>
    public static double KolmogorovSmirnov(double[] sample, Func<double, double> cdf)
    {
        var sorted = (double[])sample.Clone();
        Array.Sort(sorted);
        int n = sorted.Length;
        double d = 0;
        for (int i = 0; i < n; i++)
        {
            double f = cdf(sorted[i]);
            d = Math.Max(d, Math.Max(Math.Abs((i + 1.0) / n - f), Math.Abs(f - (double)i / n)));
        }
        return d;
    }

    /// <summary>
    /// Asymptotic critical value of D at significance 1% for n draws: 1.628/√n
    /// (Kolmogorov distribution; e.g. Press et al., Numerical Recipes 3rd ed., §14.3.3).
    /// </summary>
    public static double KsCritical1Percent(int n) => 1.628 / Math.Sqrt(n);

    /// <summary>Weighted KS distance between a weighted sample and a CDF.</summary>
    public static double KolmogorovSmirnovWeighted(double[] sample, double[] weights, Func<double, double> cdf)
    {
        var idx = Enumerable.Range(0, sample.Length).OrderBy(i => sample[i]).ToArray();
        double total = weights.Sum(), acc = 0, d = 0;
        foreach (int i in idx)
        {
            double f = cdf(sample[i]);
            d = Math.Max(d, Math.Abs(acc / total - f));
            acc += weights[i];
            d = Math.Max(d, Math.Abs(acc / total - f));
        }
        return d;
    }

    /// <summary>Mean and (unbiased) variance.</summary>
    public static (double Mean, double Variance) Moments(IReadOnlyList<double> xs)
    {
        double mean = xs.Average();
        double var = xs.Sum(x => (x - mean) * (x - mean)) / (xs.Count - 1);
        return (mean, var);
    }
}
