namespace Lightfold.Lensing;

/// <summary>Point mass with Einstein radius θ_E at (x0, y0): ψ = θ_E² ln|θ − θ0|.</summary>
/// <remarks>Schneider, Ehlers &amp; Falco 1992, Gravitational Lenses, §8.1 (from memory); magnification (u² + 2)/(u√(u² + 4)) of Paczyński 1986, ApJ 304, 1.</remarks>
public sealed record PointMass(double ThetaEArcsec, double X0Arcsec = 0, double Y0Arcsec = 0) : IMassModel
{
    /// <inheritdoc/>
    public LensPoint Evaluate(double xArcsec, double yArcsec)
    {
        double x = xArcsec - X0Arcsec, y = yArcsec - Y0Arcsec;
        double r2 = x * x + y * y, e2 = ThetaEArcsec * ThetaEArcsec;
        double f = e2 / (r2 * r2);
        return new LensPoint(0.5 * e2 * Math.Log(r2), e2 * x / r2, e2 * y / r2, f * (y * y - x * x), f * (x * x - y * y), -2.0 * f * x * y);
    }
}

/// <summary>Singular isothermal sphere: κ = θ_E / (2 r), ψ = θ_E r.</summary>
public sealed record SingularIsothermalSphere(double ThetaEArcsec) : IMassModel
{
    /// <inheritdoc/>
    public LensPoint Evaluate(double xArcsec, double yArcsec)
    {
        double r = Math.Sqrt(xArcsec * xArcsec + yArcsec * yArcsec);
        double f = ThetaEArcsec / (r * r * r);
        return new LensPoint(ThetaEArcsec * r, ThetaEArcsec * xArcsec / r, ThetaEArcsec * yArcsec / r,
            f * yArcsec * yArcsec, f * xArcsec * xArcsec, -f * xArcsec * yArcsec);
    }
}

/// <summary>External shear: ψ = ½ γ₁ (x² − y²) + γ₂ x y with φ_γ = 90° − PA, γ₁ = γ cos 2φ_γ, γ₂ = γ sin 2φ_γ (the catalog contract).</summary>
public sealed record ExternalShear(double Gamma, double PositionAngleDeg) : IMassModel
{
    /// <summary>γ₁ in the sky frame.</summary>
    public double Gamma1 => Gamma * Math.Cos(2.0 * Units.DegToRad(90.0 - PositionAngleDeg));

    /// <summary>γ₂ in the sky frame.</summary>
    public double Gamma2 => Gamma * Math.Sin(2.0 * Units.DegToRad(90.0 - PositionAngleDeg));

    /// <inheritdoc/>
    public LensPoint Evaluate(double xArcsec, double yArcsec)
    {
        double g1 = Gamma1, g2 = Gamma2;
        return new LensPoint(0.5 * g1 * (xArcsec * xArcsec - yArcsec * yArcsec) + g2 * xArcsec * yArcsec,
            g1 * xArcsec + g2 * yArcsec, g2 * xArcsec - g1 * yArcsec, g1, -g1, g2);
    }
}

/// <summary>Uniform convergence sheet κ: ψ = ½ κ r² (a mass sheet).</summary>
public sealed record ConvergenceSheet(double Kappa) : IMassModel
{
    /// <inheritdoc/>
    public LensPoint Evaluate(double xArcsec, double yArcsec)
        => new(0.5 * Kappa * (xArcsec * xArcsec + yArcsec * yArcsec), Kappa * xArcsec, Kappa * yArcsec, Kappa, Kappa, 0.0);
}

/// <summary>Sum of mass models (potentials, deflections and Hessians add).</summary>
public sealed record CompositeLens(params IMassModel[] Parts) : IMassModel
{
    /// <inheritdoc/>
    public LensPoint Evaluate(double xArcsec, double yArcsec)
    {
        var sum = default(LensPoint);
        foreach (var part in Parts) sum += part.Evaluate(xArcsec, yArcsec);
        return sum;
    }
}
