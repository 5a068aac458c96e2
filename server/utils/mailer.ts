import nodemailer from 'nodemailer'

let transport: nodemailer.Transporter | undefined

/** The SMTP transport from runtime config (NUXT_SMTP_*), made once per process. */
export function mailer(): nodemailer.Transporter {
  const { smtp } = useRuntimeConfig()
  transport ??= nodemailer.createTransport({ host: smtp.host, port: Number(smtp.port), secure: false, ignoreTLS: true, connectionTimeout: 5_000, greetingTimeout: 5_000 })
  return transport
}

/** The sender address of Rimecase's e-mails. */
export function mailFrom(): string {
  return useRuntimeConfig().smtp.from
}
